/** Batches: validating, storing and listing uploads of family files. */
export * from "./limits";
export { validateFiles, validationView, checkUploadShape, type UploadFile, type FileValidation } from "./validate";
export { storeBatch, type StoredBatch } from "./store";
export { listBatches, getBatch } from "./queries";
export { readUpload } from "./request";
