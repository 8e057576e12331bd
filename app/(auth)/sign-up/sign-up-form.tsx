"use client";

import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field } from "../field";

/// `callbackUrl` is where the new account goes (an invitation it came from); `email`
/// pre-fills the address an invitation was sent to.
export function SignUpForm({ passwordRule, callbackUrl = "/", email }: { passwordRule: string; callbackUrl?: string; email?: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  /// After a successful sign-up: what the server said (check your mail, the link's lifetime)
  /// and where "Continue" goes. The page waits for the reader instead of moving on at once, so
  /// the notice about the confirmation link is not missed.
  const [done, setDone] = useState<{ message: string; next: string; signedIn: boolean } | null>(null);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const body = {
      name: String(form.get("name") ?? ""),
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
    };
    setBusy(true);
    setError(null);
    const response = await fetch("/api/auth/signup", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify(body),
    });
    if (!response.ok) {
      const answer = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
      setError(answer?.error?.message ?? `Sign-up failed (HTTP ${response.status}).`);
      setBusy(false);
      return;
    }
    const answer = (await response.json().catch(() => null)) as { message?: unknown } | null;
    const message = typeof answer?.message === "string" ? answer.message : "Check your mail for the link that confirms your address.";
    const result = await signIn("credentials", { email: body.email, password: body.password, redirect: false });
    setBusy(false);
    const signedIn = result?.ok === true;
    const next = signedIn ? callbackUrl : callbackUrl === "/" ? "/sign-in" : `/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}`;
    setDone({ message, next, signedIn });
  }

  if (done) {
    return (
      <div role="status" aria-label="Account created" className="space-y-3">
        <p className="font-medium text-ink">
          {done.signedIn ? "Your account is created and you are signed in." : "Your account is created."}
        </p>
        <p className="rounded-md bg-paper-deep px-3 py-2 text-sm text-ink">{done.message}</p>
        <button
          type="button"
          className="button-primary"
          onClick={() => {
            router.replace(done.next);
            router.refresh();
          }}
        >
          {done.signedIn ? "Continue" : "Continue to sign in"}
        </button>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <Field id="name" label="Name" type="text" autoComplete="name" />
      <Field id="email" label="Email" type="email" autoComplete="email" defaultValue={email} />
      <Field id="password" label="Password" type="password" autoComplete="new-password" aria-describedby="password-rule">
        <p id="password-rule" className="mt-1 text-xs text-ink-soft">
          {passwordRule}
        </p>
      </Field>
      {error && (
        <p role="alert" className="rounded-md bg-signal-soft/60 px-3 py-2 text-sm text-ink">
          {error}
        </p>
      )}
      <button type="submit" className="button-primary" disabled={busy}>
        {busy ? "Creating…" : "Create account"}
      </button>
    </form>
  );
}
