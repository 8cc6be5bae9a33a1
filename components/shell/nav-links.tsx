"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";
import type { NavItem } from "./nav-items";

export function NavLinks({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <nav aria-label="Main" className="flex flex-wrap gap-1 text-sm">
      {items.map((item) => {
        const section = "/" + item.href.split("/")[1];
        const active = pathname === item.href || pathname.startsWith(section + "/") || pathname === section;
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? "page" : undefined}
            className={`whitespace-nowrap rounded-md px-3 py-1.5 font-semibold ${active ? "bg-tide-100 text-tide-700" : "text-abyss-700 hover:bg-paper"}`}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
