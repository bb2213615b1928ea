import { ResetForm } from "@/features/auth/components/reset-form";

export const metadata = { title: "Choose a new password" };

export default async function ResetPage({ searchParams }: PageProps<"/reset">) {
  const sp = await searchParams;
  return <ResetForm token={typeof sp.token === "string" ? sp.token : ""} />;
}
