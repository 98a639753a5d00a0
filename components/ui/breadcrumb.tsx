// The trail above a page's title: links back up, then where the reader is now.
import Link from "next/link";
import { Fragment } from "react";

export function Breadcrumb({ links, current }: { links: { href: string; label: string }[]; current: string }) {
  return (
    <nav aria-label="Breadcrumb" className="text-sm text-muted">
      {links.map((link) => (
        <Fragment key={link.href}>
          <Link href={link.href} className="hover:text-tide-600">
            {link.label}
          </Link>
          <span aria-hidden> / </span>
        </Fragment>
      ))}
      <span className="text-ink-soft">{current}</span>
    </nav>
  );
}
