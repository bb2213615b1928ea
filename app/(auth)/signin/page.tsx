import { redirect } from "next/navigation";
import { currentUser } from "@/lib/session";
import { SignInForm } from "@/features/auth/components/sign-in-form";

export const metadata = { title: "Sign in" };

export default async function SignInPage() {
  if (await currentUser()) redirect("/");
  return <SignInForm />;
}
