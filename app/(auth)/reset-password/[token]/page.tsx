import { NewPasswordForm } from "@/components/auth/reset-forms";

export const metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold tracking-tight">Choose a new password</h1>
      <NewPasswordForm token={token} />
    </div>
  );
}
