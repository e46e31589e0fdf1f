import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { getServerSession } from "next-auth";
import { z } from "zod";
import { findUserByEmail, findUserById, recentFailures, recordFailure, clearFailures, toPublicUser, MAX_FAILS_PER_EMAIL, MAX_FAILS_PER_IP } from "@/db/users";
import { checkPassword } from "./passwords";

const credentials = z.object({ email: z.string().trim().email().max(254), password: z.string().min(1).max(200) });

function clientIp(headers: Record<string, unknown> | undefined): string {
  const fwd = headers?.["x-forwarded-for"];
  const first = typeof fwd === "string" ? fwd.split(",")[0].trim() : "";
  return first || "local";
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 60 * 60 * 24 * 14 },
  pages: { signIn: "/sign-in" },
  secret: process.env.NEXTAUTH_SECRET,
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(raw, req) {
        const parsed = credentials.safeParse(raw);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const ip = clientIp(req?.headers as Record<string, unknown> | undefined);
        const fails = await recentFailures(email, ip);
        if (fails.email >= MAX_FAILS_PER_EMAIL || fails.ip >= MAX_FAILS_PER_IP) {
          // The same answer as a wrong password would leak nothing, but the builder deserves to know why.
          throw new Error("Too many failed sign-ins. Wait 15 minutes and try again.");
        }
        const user = await findUserByEmail(email);
        const ok = user ? await checkPassword(password, user.password_hash) : false;
        if (!user || !ok) {
          await recordFailure(email, ip);
          return null;
        }
        await clearFailures(email);
        return { id: user.id, email: user.email, name: user.name };
      },
    }),
  ],
  callbacks: {
    async session({ session, token }) {
      if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
      return session;
    },
  },
};

/** The signed-in user, read fresh from the database (a deleted user is signed out). */
export async function getSessionUser() {
  const session = await getServerSession(authOptions);
  const id = (session?.user as { id?: string } | undefined)?.id;
  if (!id) return null;
  const row = await findUserById(id);
  return row ? toPublicUser(row) : null;
}
export type SessionUser = NonNullable<Awaited<ReturnType<typeof getSessionUser>>>;
