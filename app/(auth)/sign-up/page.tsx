import type { Metadata } from "next";
import { AuthFrame, TextLink } from "@/components/shell/AuthFrame";
import { SignUpForm } from "./SignUpForm";

export const metadata: Metadata = { title: "Start a shop" };

export default function SignUpPage() {
  return (
    <AuthFrame
      title="Start a shop on Riseline"
      intro="You become the shop's owner and can invite your crew next."
      footer={
        <p>
          Already have an account? <TextLink href="/sign-in">Sign in</TextLink>
        </p>
      }
    >
      <SignUpForm />
    </AuthFrame>
  );
}
