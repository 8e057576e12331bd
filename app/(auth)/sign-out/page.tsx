import type { Metadata } from "next";
import { SignOutButton } from "./sign-out-button";

export const metadata: Metadata = { title: "Sign out · Ringside" };

export default function SignOutPage() {
  return (
    <>
      <h1 className="mb-2 text-lg font-semibold">Sign out</h1>
      <p className="mb-4 text-sm text-ink-soft">Your sessions stay saved; sign in again to continue.</p>
      <SignOutButton />
    </>
  );
}
