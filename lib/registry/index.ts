/** The registry: one entry per family, summarising its variants' reports, with curation. */
export { refreshRegistryEntry, latestReports, reportVerdicts, summarise, summariseAgreement, type ReportVerdicts } from "./refresh";
export * from "./filters";
export { listRegistry, iterateRegistry, countRegistry, registryWhere, registryOrder, registryRow, type RegistryRow, type RegistryPage } from "./queries";
export { visibleEntriesWhere, canSeeEntry, canCurate } from "./visibility";
export { exportRegistry, csvField, csvLine, CSV_COLUMNS } from "./export";
export { curateEntry, setEntryTags, markDuplicate, setPublished, duplicateCandidates, CURATION_ACTIONS, MAX_NOTE_LENGTH, type CurationAction, type CurationResult } from "./curation";
export { recordReport, type RecordResult, type RecordOptions } from "./ingest";
export { hardwareConcern, type HardwareConcern, type HardwareSubject } from "./safety";
export { coefficientsKey, parseStoredCoefficients, readStoredSpec, type StoredSpec } from "./coefficients";
export { getEntryDetail, findVisibleEntry, entryHistory, entryReports, VARIANTS_PER_PAGE, type EntryDetail, type VariantSummary, type HistoryItem } from "./entry";
export { exportEntry, entryLatex, familyFileYaml, latexText, type EntryExportFormat } from "./entry-export";
export { equationLatex, coefficientLines, NORMAL_FORM_LATEX } from "./equation-latex";
export { readReport, type ReportView, type Stage } from "./report-view";
export { reviewQueue, REVIEW_LIST_LIMIT, type ReviewQueue } from "./review";
