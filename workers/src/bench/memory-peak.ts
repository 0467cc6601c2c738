/** Peak memory of the process: the kernel's own maximum resident set, and the largest heap seen at checkpoints. */
export class MemoryPeak {
  private heapMax = 0;

  checkpoint(): void {
    this.heapMax = Math.max(this.heapMax, process.memoryUsage().heapUsed);
  }

  /** maxRSS is kept by the operating system (getrusage), so it covers moments between checkpoints too. */
  peakRssMb(): number {
    return process.resourceUsage().maxRSS / 1024;
  }

  peakHeapMb(): number {
    this.checkpoint();
    return this.heapMax / (1024 * 1024);
  }
}
