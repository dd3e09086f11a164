import { randomUUID } from 'node:crypto';
import type { ExportJobDto } from '@shared/api';
import { AppError } from '../../errors';
import type { BundleProgress } from './bundle';

/**
 * Zips being prepared, held in memory by the app that made them (one per createApp, no global
 * state): a job belongs to one person and one project, runs once, and its file is kept for
 * KEEP_MS after it finishes so the browser can fetch it. Nothing here touches the database.
 */

const KEEP_MS = 15 * 60 * 1000;
/** Jobs one person may have running at once. */
const MAX_RUNNING_PER_USER = 2;
/** Finished jobs kept in memory at most (oldest dropped first). */
const MAX_FINISHED = 20;

interface Job {
  id: string;
  projectId: number;
  userId: number;
  fileName: string;
  state: 'running' | 'done' | 'failed';
  progress: BundleProgress;
  file: Buffer | null;
  error: string | null;
  finishedAt: number | null;
}

export class BundleJobs {
  private readonly jobs = new Map<string, Job>();

  /** Start a job; 429 when the person already has MAX_RUNNING_PER_USER running. `onError` logs a failure. */
  start(
    owner: { projectId: number; userId: number },
    fileName: string,
    work: (report: (p: BundleProgress) => void) => Promise<Buffer>,
    onError: (err: unknown) => void,
  ): Job {
    this.prune();
    const running = [...this.jobs.values()].filter((j) => j.userId === owner.userId && j.state === 'running').length;
    if (running >= MAX_RUNNING_PER_USER) {
      throw new AppError(429, 'too_many_exports', 'Two zips are already being prepared for you. Wait for them to finish, then try again.');
    }
    const job: Job = {
      id: randomUUID(),
      ...owner,
      fileName,
      state: 'running',
      progress: { phase: 'data', label: 'Collecting the data', done: 0, total: 1, percent: 0 },
      file: null,
      error: null,
      finishedAt: null,
    };
    this.jobs.set(job.id, job);
    // Runs after the request has been answered; failures end the job, never the process.
    void work((p) => {
      job.progress = p;
    })
      .then((file) => {
        job.file = file;
        job.state = 'done';
      })
      .catch((err: unknown) => {
        job.state = 'failed';
        job.error = 'The zip could not be made. The error has been logged; try again, or export the files one by one.';
        onError(err);
      })
      .finally(() => {
        job.finishedAt = Date.now();
      });
    return job;
  }

  /** The caller's job in this project, or undefined (someone else's job is not revealed). */
  get(id: string, owner: { projectId: number; userId: number }): Job | undefined {
    this.prune();
    const job = this.jobs.get(id);
    return job && job.projectId === owner.projectId && job.userId === owner.userId ? job : undefined;
  }

  private prune(): void {
    const now = Date.now();
    const finished = [...this.jobs.values()].filter((j) => j.finishedAt !== null).sort((a, b) => a.finishedAt! - b.finishedAt!);
    for (const j of finished) if (now - j.finishedAt! > KEEP_MS) this.jobs.delete(j.id);
    const left = finished.filter((j) => this.jobs.has(j.id));
    for (const j of left.slice(0, Math.max(0, left.length - MAX_FINISHED))) this.jobs.delete(j.id);
  }
}

/** The job as the client sees it. */
export function presentJob(job: Job, basePath: string): ExportJobDto {
  const done = job.state === 'done';
  return {
    id: job.id,
    state: job.state,
    phase: done ? 'done' : job.state === 'failed' ? 'failed' : job.progress.phase,
    label: done ? 'Ready to download' : job.state === 'failed' ? 'Failed' : job.progress.label,
    done: job.progress.done,
    total: job.progress.total,
    percent: done ? 100 : job.progress.percent,
    fileName: job.fileName,
    byteSize: job.file ? job.file.length : null,
    error: job.error,
    downloadUrl: done ? `${basePath}/bundle/${job.id}/download` : null,
  };
}

export type { Job as BundleJob };
