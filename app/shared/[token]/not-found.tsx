import Link from "next/link";

export default function SharedLinkNotFound() {
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-3 py-12 text-center">
      <h1 className="text-2xl font-semibold text-ink">This link does not work</h1>
      <p className="text-[15px] leading-relaxed text-ink-soft">
        The link may be incomplete, or its owner has revoked it. Ask whoever sent it for a new one. Team members can{" "}
        <Link href="/sign-in" className="font-medium text-tide-700 hover:underline">
          sign in
        </Link>{" "}
        to open the study in the workbench.
      </p>
    </div>
  );
}
