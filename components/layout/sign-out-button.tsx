"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button type="button" onClick={() => signOut({ callbackUrl: "/sign-in" })} className="text-xs text-muted underline-offset-2 hover:text-text hover:underline">
      Sign out
    </button>
  );
}
