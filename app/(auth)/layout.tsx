/// The frame of the sign-in, sign-up and sign-out pages.
export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center px-4">
      <div className="w-full max-w-sm">
        <p className="mb-6 text-center font-mono text-2xl font-semibold tracking-tight text-ink">
          Ringside<span className="text-signal">.</span>
        </p>
        <div className="rounded-xl border border-ink/10 bg-white p-6 shadow-sm">{children}</div>
      </div>
    </main>
  );
}
