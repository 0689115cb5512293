/**
 * One app server for the HTTP benchmarks, in a process of its own so that the load generator
 * (autocannon, in the bench's process) does not share its event loop. Prints one JSON line,
 * `{ "base": …, "publicUrl": … }`, once it listens; its memory as a JSON line on SIGUSR2; stops on SIGTERM.
 *
 *   BENCH_POOL_MAX=10 BENCH_COMPUTE_PER_MINUTE=… tsx tests/bench/serve.ts
 */
import { startBenchServer } from './lib';

async function main() {
  const server = await startBenchServer({
    poolMax: Number(process.env.BENCH_POOL_MAX ?? 10),
    computeRateLimitPerMinute: process.env.BENCH_COMPUTE_PER_MINUTE ? Number(process.env.BENCH_COMPUTE_PER_MINUTE) : undefined,
  });
  process.stdout.write(`${JSON.stringify({ base: server.base, publicUrl: server.config.publicUrl })}\n`);
  // The bench asks for this process's memory with SIGUSR2.
  process.on('SIGUSR2', () => {
    const m = process.memoryUsage();
    process.stdout.write(`${JSON.stringify({ memory: { rss: m.rss, heapUsed: m.heapUsed } })}\n`);
  });
  process.once('SIGTERM', () => {
    void server.close().then(() => process.exit(0));
  });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
