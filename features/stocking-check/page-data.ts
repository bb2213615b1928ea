import "server-only";
import { listCommodities } from "@/lib/engine/loads";
import type { FacilityModel } from "@/lib/engine/model";
import { loadFacilityModel } from "@/features/facilities/model";
import { AppError } from "@/lib/errors";
import { listScenarios } from "./queries";
import type { CommodityOption, RoomOption } from "./schema";

/** What the Stocking checks page needs: the rooms as they are now, the commodity library and the saved checks. */
export async function stockingPageData(workspaceId: string, facilityId: string) {
  const m = await loadFacilityModel(workspaceId, facilityId);
  let model: FacilityModel | null = null;
  let modelError: string | null = null;
  try {
    model = m.engineModel();
  } catch (e) {
    modelError = e instanceof AppError ? e.message : "The model cannot be read.";
  }
  const rooms: RoomOption[] = (model?.rooms ?? []).map((r) => {
    const p = r.products[0];
    const st = r.storedProduce[0];
    return {
      id: r.id,
      name: r.name,
      setPointC: r.setPointC,
      product: p ? { commodityId: p.commodityId, tonnesPerDay: p.massKgPerDay / 1000, enteringTempC: p.enteringTempC, finalTempC: p.finalTempC ?? null, pullDownHours: p.pullDownHours } : null,
      stored: st ? { commodityId: st.commodityId, massKg: st.massKg ?? (st.palletPositions ?? 0) * (st.kgPerPallet ?? 0) } : null,
    };
  });
  const inst = model?.plant.installed;
  const installedRecorded = Boolean(inst && inst.evaporators.length + inst.compressors.length + inst.condensers.length > 0);
  const commodities: CommodityOption[] = listCommodities().map((c) => ({ id: c.id, name: c.name, group: c.group }));
  return { version: m.version, rooms, commodities, installedRecorded, modelError, scenarios: await listScenarios(workspaceId, facilityId) };
}
