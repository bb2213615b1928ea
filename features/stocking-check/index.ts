export * from "./schema";
export { verdictLine, checkLine, solveLines, emailText, VERDICT_WORDS } from "./summary";
