import type { SiteConditions } from "@/features/facilities/schema";
import type { Evaluation } from "../evaluate";
import type { CanvasDoc } from "../schema";

export interface EngineRequest {
  seq: number;
  doc: CanvasDoc;
  site: SiteConditions;
}

export type EngineResponse = { seq: number; evaluation: Evaluation; failure?: undefined } | { seq: number; failure: string; evaluation?: undefined };
