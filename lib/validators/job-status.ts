/** The life of a job, in order. The database's check constraint and every form use this one list. */
export const JOB_STATUSES = ["open", "diagnosed", "repaired", "closed"] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];
