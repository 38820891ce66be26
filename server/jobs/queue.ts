// Persisted analysis jobs. Any number of server processes share the table: a job is claimed inside a
// transaction with SELECT … FOR UPDATE SKIP LOCKED, so two processes never take the same row, and a job
// whose process died (no heartbeat for a while) becomes claimable again. New uploads go first; re-analyses
// after an engine change run in the background, leaving the recording and its current analysis as they are
// until the new result replaces it.
import os from 'node:os';
import crypto from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '@/server/db';
import { config } from '@/server/config';
import { Analysis, AnalysisJob, Recording } from '@/server/models';

/** This process's name in the lockedBy / finishedBy columns. */
export const processName = `${os.hostname()}:${process.pid}:${crypto.randomBytes(3).toString('hex')}`;

export async function enqueue(recordingId: string, transaction?: Transaction) {
  await AnalysisJob.create({ recordingId }, { transaction });
}

export interface ClaimedJob {
  jobId: string;
  recordingId: string;
  storageKey: string;
  attempt: number;
  /** A re-analysis of a recording that already has a result: its status and progress are not touched. */
  background: boolean;
}

/** Job priorities: a player waits for an upload's analysis; nobody waits for a re-analysis. */
export const UPLOAD_PRIORITY = 0;
export const BACKGROUND_PRIORITY = 1;

export async function claimNext(): Promise<ClaimedJob | null> {
  return sequelize.transaction(async (t) => {
    const staleBefore = new Date(Date.now() - config.analysis.staleAfterMs);
    const rows = await sequelize.query<{ id: string; recordingId: string; attempts: number; priority: number }>(
      `SELECT id, recordingId, attempts, priority FROM analysis_jobs
        WHERE (status = 'queued' OR (status = 'running' AND heartbeatAt < :staleBefore))
        ORDER BY priority, createdAt LIMIT 1 FOR UPDATE SKIP LOCKED`,
      { type: QueryTypes.SELECT, replacements: { staleBefore }, transaction: t },
    );
    const row = rows[0];
    if (!row) return null;
    const recording = await Recording.findByPk(row.recordingId, { transaction: t });
    if (!recording) return null;
    const background = row.priority === BACKGROUND_PRIORITY;
    if (row.attempts >= config.analysis.maxAttempts) {
      await AnalysisJob.update(
        { status: 'failed', lastError: 'gave up after repeated interruptions' },
        { where: { id: row.id }, transaction: t },
      );
      if (!background)
        await recording.update(
          { status: 'failed', error: 'the analysis was interrupted too many times; retry it' },
          { transaction: t },
        );
      return null;
    }
    await AnalysisJob.update(
      { status: 'running', lockedBy: processName, heartbeatAt: new Date(), attempts: row.attempts + 1 },
      { where: { id: row.id }, transaction: t },
    );
    if (!background) await recording.update({ status: 'running', progress: 0, error: null }, { transaction: t });
    return {
      jobId: row.id,
      recordingId: row.recordingId,
      storageKey: recording.storageKey,
      attempt: row.attempts + 1,
      background,
    };
  });
}

/** Keeps a running job ours; also records its progress. False when the job is no longer ours. */
export async function heartbeat(job: ClaimedJob, progress: number): Promise<boolean> {
  const [n] = await AnalysisJob.update(
    { heartbeatAt: new Date() },
    { where: { id: job.jobId, lockedBy: processName, status: 'running' } },
  );
  if (n && !job.background) await Recording.update({ progress }, { where: { id: job.recordingId } });
  return n > 0;
}

/** Stores the result once: only while the job is still locked by this process. */
export async function complete(
  job: ClaimedJob,
  result: unknown,
  peaks: unknown,
  engineMs: number,
  engineVersion: number,
): Promise<boolean> {
  return sequelize.transaction(async (t) => {
    const [n] = await AnalysisJob.update(
      { status: 'done', finishedBy: processName, heartbeatAt: new Date(), lastError: null },
      { where: { id: job.jobId, lockedBy: processName, status: 'running' }, transaction: t },
    );
    if (!n) return false;
    await Analysis.upsert(
      {
        recordingId: job.recordingId,
        result: JSON.stringify(result),
        peaks: JSON.stringify(peaks),
        engineMs,
        engineVersion,
      },
      { transaction: t },
    );
    await Recording.update(
      { status: 'done', progress: 1, error: null },
      { where: { id: job.recordingId }, transaction: t },
    );
    return true;
  });
}

export async function fail(job: ClaimedJob, reason: string): Promise<void> {
  await sequelize.transaction(async (t) => {
    const [n] = await AnalysisJob.update(
      { status: 'failed', lastError: reason, finishedBy: processName },
      { where: { id: job.jobId, lockedBy: processName }, transaction: t },
    );
    // A failed re-analysis keeps the result the recording already has.
    if (n && !job.background)
      await Recording.update({ status: 'failed', error: reason }, { where: { id: job.recordingId }, transaction: t });
  });
}

/** A failed analysis goes back in the queue with a fresh count of attempts. */
export async function retry(recordingId: string): Promise<boolean> {
  return sequelize.transaction(async (t) => {
    const [n] = await AnalysisJob.update(
      { status: 'queued', attempts: 0, lockedBy: null, lastError: null },
      { where: { recordingId, status: 'failed' }, transaction: t },
    );
    if (n)
      await Recording.update(
        { status: 'queued', progress: 0, error: null },
        { where: { id: recordingId }, transaction: t },
      );
    return n > 0;
  });
}

/** A job whose worker thread died goes back to the queue at once (its attempt still counts). */
export async function release(job: ClaimedJob, reason: string): Promise<void> {
  const [n] = await AnalysisJob.update(
    { status: 'queued', lockedBy: null, lastError: reason },
    { where: { id: job.jobId, lockedBy: processName, status: 'running' } },
  );
  if (n && !job.background)
    await Recording.update({ status: 'queued', progress: 0 }, { where: { id: job.recordingId } });
}

/**
 * Queues a background re-analysis of every recording whose analysis an older engine version made (or, with
 * `all`, of every analysed recording). The player's corrections live on the recording row and are untouched.
 * Safe to run from several processes at once: a job already queued or running is left alone.
 */
export async function queueReanalyses(currentVersion: number, opts: { all?: boolean } = {}): Promise<number> {
  const [, affected] = await sequelize.query(
    `UPDATE analysis_jobs j JOIN analyses a ON a.recordingId = j.recordingId
        SET j.status = 'queued', j.priority = :priority, j.attempts = 0, j.lockedBy = NULL, j.lastError = NULL, j.updatedAt = NOW(3)
      WHERE j.status IN ('done', 'failed') AND a.engineVersion ${opts.all ? '<=' : '<'} :currentVersion`,
    { type: QueryTypes.UPDATE, replacements: { priority: BACKGROUND_PRIORITY, currentVersion } },
  );
  return Number(affected);
}
