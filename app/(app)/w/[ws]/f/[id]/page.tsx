import { redirect } from "next/navigation";
import { FACILITY_TABS } from "@/features/facilities/components/facility-tabs";

/** A facility opens on its first view. */
export default async function FacilityIndex({ params }: PageProps<"/w/[ws]/f/[id]">) {
  const { ws, id } = await params;
  redirect(`/w/${ws}/f/${id}/${FACILITY_TABS[0].slug}`);
}
