import type { Metadata } from "next";
import { AuthFrame, TextLink } from "@/components/shell/AuthFrame";
import { Alert } from "@/components/ui";
import { ResetPasswordForm } from "./ResetPasswordForm";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string; error?: string }> }) {
  const { token, error } = await searchParams;
  const usable = token && !error;
  return (
    <AuthFrame
      title="Choose a new password"
      footer={
        <p>
          <TextLink href="/sign-in">Back to sign in</TextLink>
        </p>
      }
    >
      {usable ? (
        <ResetPasswordForm token={token} />
      ) : (
        <Alert tone="error" title="This link does not work any more" action={<TextLink href="/forgot-password">Ask for a new link</TextLink>}>
          Reset links work once and for one hour.
        </Alert>
      )}
    </AuthFrame>
  );
}
