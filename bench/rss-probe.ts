/**
 * Preloaded into a benchmarked CLI run (`node --import .../rss-probe.js`): at exit the main
 * thread writes the process's peak RSS (worker threads share the process, so this covers
 * them) and its CPU time (user + system, every thread) to the file named by
 * PASSBUDGET_BENCH_RSS_FILE, as "<maxRSS kB> <cpu µs>". Benchmark use only.
 */
import { writeFileSync } from 'node:fs';
import { isMainThread } from 'node:worker_threads';

const file = process.env.PASSBUDGET_BENCH_RSS_FILE;
if (isMainThread && file) {
  process.on('exit', () => {
    const u = process.resourceUsage();
    writeFileSync(file, `${u.maxRSS} ${u.userCPUTime + u.systemCPUTime}`);
  });
}
