import Link from "next/link";
import { LogoMark } from "./logo-mark";
import { NavLinks } from "./nav-links";
import { NAV_ITEMS } from "./nav-items";
import { SignOutButton } from "./sign-out-button";
import { hasRole, ROLE_LABELS } from "@/lib/auth/roles";
import type { CurrentUser } from "@/lib/auth/current-user";

export function AppShell({ user, children }: { user: CurrentUser; children: React.ReactNode }) {
  const items = NAV_ITEMS.filter((i) => hasRole(user.role, i.needs));
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-panel">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
          <Link href="/overview" className="flex items-center gap-2 text-lg font-bold tracking-tight text-abyss-900">
            <LogoMark /> Wavesieve
          </Link>
          <div className="order-3 w-full sm:order-none sm:w-auto sm:flex-1">
            <NavLinks items={items} />
          </div>
          <div className="ml-auto flex items-center gap-2 text-sm">
            <Link href="/account" className="text-abyss-700 hover:underline" data-testid="account-link">
              {user.name} <span className="rounded bg-paper px-1.5 py-0.5 text-xs font-semibold text-abyss-500">{ROLE_LABELS[user.role]}</span>
            </Link>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-4 py-6">{children}</main>
    </div>
  );
}
