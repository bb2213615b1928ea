import { requireUser } from "@/lib/session";
import { AccountForm } from "@/features/account/components/account-form";

export const metadata = { title: "Units and theme" };

export default async function AccountPage() {
  const u = await requireUser();
  return <AccountForm name={u.name} unitSystem={u.unitSystem} theme={u.theme} />;
}
