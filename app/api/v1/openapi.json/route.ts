import { route } from "@/lib/api";
import { env } from "@/lib/env";
import { openApiDocument } from "@/features/calculate/openapi";

let cached: ReturnType<typeof openApiDocument> | null = null;

export const GET = route({ public: true, handler: async () => (cached ??= openApiDocument(env.APP_URL)) });
