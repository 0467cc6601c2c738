import { readFileSync, writeFileSync } from 'node:fs';

/**
 * Resident memory of another process from Linux's /proc: VmHWM is the kernel's own peak, so it covers
 * every moment, not just the moments we happen to sample.
 */
export class ProcessMemory {
  constructor(readonly pid: number) {}

  private statusMb(field: 'VmRSS' | 'VmHWM'): number {
    const status = readFileSync(`/proc/${this.pid}/status`, 'utf8');
    const match = new RegExp(`^${field}:\\s+(\\d+) kB`, 'm').exec(status);
    if (!match) throw new Error(`/proc/${this.pid}/status has no ${field} line`);
    return Number(match[1]) / 1024;
  }

  rssMb(): number {
    return this.statusMb('VmRSS');
  }

  /** The peak since the process started or since the last resetPeak(). */
  peakMb(): number {
    return this.statusMb('VmHWM');
  }

  /** Writing 5 to clear_refs resets VmHWM to the current RSS (Linux ≥ 4.0), so a peak covers one phase. */
  resetPeak(): void {
    writeFileSync(`/proc/${this.pid}/clear_refs`, '5');
  }
}
