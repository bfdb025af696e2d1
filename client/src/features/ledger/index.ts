// What the rest of the app may use from the ledger feature (a revision's results).
export { RevisionOverviewPanel } from './components/revision-overview';
export { MemberLedger, type MemberLedgerProps } from './components/member-ledger';
export { MemberTable, type MemberTableProps } from './components/member-table';
export { UtilisationChart } from './components/utilisation-chart';
