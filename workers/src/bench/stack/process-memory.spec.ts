import { ProcessMemory } from './process-memory';

describe('ProcessMemory (Linux /proc)', () => {
  it('reports a peak at least as large as the current resident memory, and resets it', () => {
    const memory = new ProcessMemory(process.pid);
    const ballast = Buffer.alloc(64 * 1024 * 1024, 1);
    expect(memory.rssMb()).toBeGreaterThan(64);
    expect(memory.peakMb()).toBeGreaterThanOrEqual(memory.rssMb() - 1);
    memory.resetPeak();
    expect(memory.peakMb()).toBeLessThanOrEqual(memory.rssMb() + 16);
    expect(ballast[0]).toBe(1);
  });

  it('names the process it could not read', () => {
    expect(() => new ProcessMemory(2 ** 22 + 7).rssMb()).toThrow(/\/proc\/4194311\/status/);
  });
});
