"use client";
import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button type="button" onClick={() => signOut({ callbackUrl: "/signin" })} className="rounded-md px-2 py-1 text-sm text-abyss-700 underline-offset-2 hover:underline">
      Sign out
    </button>
  );
}
