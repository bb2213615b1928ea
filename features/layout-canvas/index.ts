export { CanvasEditor } from "./components/canvas-editor";
export type { CanvasDoc, LayoutDto } from "./schema";
export { layoutPutSchema, MAX_BACKGROUND_BYTES } from "./schema";
export { linksOf, checkConnection, pruneIncomplete, autoLayout } from "./graph";
