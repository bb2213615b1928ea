export { LedgerView } from "./components/ledger-view";
export { ledgerRows, stackByRoom, KIND_LABEL, type LedgerRow } from "./rows";
