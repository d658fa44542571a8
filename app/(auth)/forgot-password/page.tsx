import type { Metadata } from "next";
import { AuthFrame, TextLink } from "@/components/shell/AuthFrame";
import { ForgotPasswordForm } from "./ForgotPasswordForm";

export const metadata: Metadata = { title: "Reset password" };

export default async function ForgotPasswordPage({ searchParams }: { searchParams: Promise<{ email?: string }> }) {
  const { email } = await searchParams;
  return (
    <AuthFrame
      title="Forgot your password?"
      intro="We e-mail you a link to choose a new one."
      footer={
        <p>
          Remembered it? <TextLink href="/sign-in">Back to sign in</TextLink>
        </p>
      }
    >
      <ForgotPasswordForm email={email} />
    </AuthFrame>
  );
}
