import { AuthCard } from "@/components/auth/auth-card";
import { SetPasswordForm } from "@/components/auth/set-password-form";

export const metadata = { title: "Set your password" };

export default async function WelcomePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <AuthCard title="Set your password">
      <SetPasswordForm token={token} />
    </AuthCard>
  );
}
