import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "quiet" | "danger";
type Size = "sm" | "md";

const variants: Record<Variant, string> = {
  primary: "bg-tide-600 text-white hover:bg-tide-700 disabled:bg-tide-300 shadow-sm",
  secondary: "bg-panel text-ink border border-rule-strong hover:border-ink-soft hover:bg-paper disabled:text-muted",
  quiet: "text-ink-soft hover:bg-ink/5 hover:text-ink disabled:text-muted",
  danger: "bg-signal-error text-white hover:bg-ember-700 disabled:opacity-50",
};

const sizes: Record<Size, string> = {
  sm: "h-8 px-3 text-sm gap-1.5",
  md: "h-10 px-4 text-[15px] gap-2",
};

export function buttonClasses(variant: Variant = "primary", size: Size = "md"): string {
  return `inline-flex items-center justify-center rounded-md font-medium transition-colors disabled:cursor-not-allowed ${variants[variant]} ${sizes[size]}`;
}

export function Button({
  variant = "primary",
  size = "md",
  className = "",
  type = "button",
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: Size }) {
  return <button type={type} className={`${buttonClasses(variant, size)} ${className}`} {...props} />;
}
