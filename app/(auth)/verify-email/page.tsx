import type { Metadata } from "next";
import Link from "next/link";
import { confirmEmail } from "@/lib/auth/email-verification";

export const metadata: Metadata = { title: "Confirm your address · Ringside", referrer: "no-referrer" };
export const dynamic = "force-dynamic";

const WHY: Record<"unknown" | "expired", string> = {
  unknown: "This link is not valid (it may have been used already). Signing in works either way; ask for help if teams cannot invite you.",
  expired: "This link has expired. Create the account again to get a new one, or ask a site administrator.",
};

/// The page the welcome mail links to: confirms the address the link was sent to.
export default async function VerifyEmailPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { token } = await searchParams;
  const outcome = await confirmEmail(typeof token === "string" ? token : "");
  return (
    <>
      <h1 className="mb-2 text-lg font-semibold">{outcome.ok ? "Address confirmed" : "Cannot confirm this address"}</h1>
      <p role={outcome.ok ? "status" : "alert"} className="mb-4 text-sm text-ink-soft">
        {outcome.ok ? `${outcome.email} is confirmed: teams can now invite you and colleagues can share with you.` : WHY[outcome.why]}
      </p>
      <Link className="font-medium text-ink underline" href="/">
        Open Ringside
      </Link>
    </>
  );
}
