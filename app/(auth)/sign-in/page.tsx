import type { Metadata } from "next";
import { AuthFrame, TextLink } from "@/components/shell/AuthFrame";
import { SignInForm } from "./SignInForm";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string; email?: string; reset?: string }> }) {
  const sp = await searchParams;
  return (
    <AuthFrame
      title="Sign in"
      intro="Your shop's test records, on the job and in the office."
      footer={
        <>
          <p>
            New shop? <TextLink href="/sign-up">Start one on Riseline</TextLink>
          </p>
          <p className="text-caption">Joining a crew? Open the invitation link your shop owner e-mailed you.</p>
        </>
      }
    >
      <SignInForm next={sp.next} email={sp.email} justReset={sp.reset === "1"} />
    </AuthFrame>
  );
}
