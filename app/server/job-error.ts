/** A failed job's error as the page polls it: what a call would have answered (status, field, message). */
export type JobError = { field?: string; message: string; status: number };
