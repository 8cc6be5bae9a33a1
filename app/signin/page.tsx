import { redirect } from "next/navigation";
import { getPageUser } from "@/lib/auth/page";
import { AuthCard } from "@/components/auth/auth-card";
import { SignInForm } from "@/components/auth/sign-in-form";

export const metadata = { title: "Sign in" };
export const dynamic = "force-dynamic";

export default async function SignInPage() {
  if (await getPageUser()) redirect("/overview");
  return (
    <AuthCard title="Sign in">
      <SignInForm />
      <p className="mt-4 text-xs text-abyss-500">Accounts are created by invitation. Ask your group&apos;s admin.</p>
    </AuthCard>
  );
}
