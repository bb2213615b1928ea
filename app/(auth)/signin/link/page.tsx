import { LinkSignIn } from "@/features/auth/components/link-sign-in";

export const metadata = { title: "Signing in" };

export default async function LinkPage({ searchParams }: PageProps<"/signin/link">) {
  const sp = await searchParams;
  const token = typeof sp.token === "string" ? sp.token : "";
  return <LinkSignIn token={token} />;
}
