import "next-auth";
import "next-auth/jwt";

declare module "next-auth" {
  interface Session {
    /// `sv`: the session version the token was issued under (lib/auth/options.ts).
    user: { id: string; sv: number; name?: string | null; email?: string | null };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    sv?: number;
  }
}
