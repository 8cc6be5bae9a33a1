import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { verifyCredentials } from "./sign-in";
import { isRole } from "./roles";

export const SESSION_MAX_AGE_SECONDS = 8 * 60 * 60;

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
  secret: process.env.NEXTAUTH_SECRET,
  pages: { signIn: "/signin" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials) {
        const result = await verifyCredentials(credentials?.email, credentials?.password);
        if (!result.ok) {
          // next-auth passes the message to the client as `error`.
          throw new Error(result.reason === "locked" ? "locked" : result.reason === "disabled" ? "disabled" : "CredentialsSignin");
        }
        return result.user;
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.role = user.role;
        token.uid = user.id;
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && isRole(token.role) && token.uid) {
        session.user.role = token.role;
        session.user.id = token.uid;
      }
      return session;
    },
  },
};
