"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export interface NavItem {
  href: string;
  label: string;
}

export function WorkspaceNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <nav aria-label="Workspace" className="no-print -mb-px flex gap-1 overflow-x-auto">
      {items.map((item) => {
        const current = item.href === pathname || (item.href.split("/").length > 3 && pathname.startsWith(item.href));
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={current ? "page" : undefined}
            className={`whitespace-nowrap border-b-2 px-3 py-2 text-sm font-medium ${
              current ? "border-brass-500 text-chart-ink" : "border-transparent text-chart-muted hover:text-chart-ink"
            }`}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
