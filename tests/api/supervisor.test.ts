import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { restartDelay, supervise, type ChildSpec } from '../../scripts/supervisor/supervise';
import { waitFor } from '../helpers/messaging';

// R9: npm start's supervisor with small stand-in children (plain node one-liners; no network, bounded times).
const dir = mkdtempSync(path.join(tmpdir(), 'nestflow-supervisor-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const nodeChild = (name: string, code: string): ChildSpec => ({ name, command: process.execPath, args: ['-e', code] });
const steady = () => nodeChild('steady', 'setInterval(() => {}, 1000)');
/** Ends with code 3 on its first run only (a marker file remembers), then keeps running. */
const crashesOnce = (marker: string) => nodeChild('flaky', `const fs = require('fs'); if (!fs.existsSync(${JSON.stringify(marker)})) { fs.writeFileSync(${JSON.stringify(marker)}, ''); setTimeout(() => process.exit(3), 100); } else setInterval(() => {}, 1000);`);
const alive = (pid: number | undefined) => {
  if (!pid) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};
const fast = { initialDelayMs: 20, maxDelayMs: 1000, crashLimit: 5, windowMs: 60_000, stopTimeoutMs: 3000 };

describe('the process supervisor', () => {
  it('when one child crashes, then it is restarted after a delay with a log line, and the other keeps running untouched', async () => {
    const lines: string[] = [];
    const sup = supervise([steady(), crashesOnce(path.join(dir, 'once-a'))], { ...fast, log: (l) => lines.push(l) });
    await waitFor('both to start', async () => alive(sup.pids().steady) && alive(sup.pids().flaky));
    const steadyPid = sup.pids().steady;
    const firstFlaky = sup.pids().flaky;
    await waitFor('the restart', async () => sup.pids().flaky !== undefined && sup.pids().flaky !== firstFlaky && alive(sup.pids().flaky), 10_000);
    expect(lines).toEqual(['flaky ended (code 3); restarting in 20 ms (1 of 5 allowed within 60 s)']);
    expect(sup.pids().steady).toBe(steadyPid);
    const pids = Object.values(sup.pids());
    await sup.stop();
    expect(await sup.done).toEqual({ reason: 'stopped' });
    expect(pids.filter(alive)).toEqual([]);
    expect(lines).toHaveLength(1);
  });

  it('when a child crashes 5 times within 60 s, then the delays double and everything stops', async () => {
    const lines: string[] = [];
    const sup = supervise([steady(), nodeChild('broken', 'process.exit(1)')], { ...fast, log: (l) => lines.push(l) });
    await waitFor('the steady child', async () => alive(sup.pids().steady));
    const steadyPid = sup.pids().steady;
    expect(await sup.done).toEqual({ reason: 'crash-loop', name: 'broken' });
    expect(lines.map((l) => /restarting in (\d+) ms/.exec(l)?.[1] ?? l)).toEqual(['20', '40', '80', '160', 'broken ended (code 1) 5 times within 60 s; stopping everything']);
    expect(alive(steadyPid)).toBe(false);
  }, 20_000);

  it('when crashes are spread out beyond the window, then the count starts again and the delay stays at its first step', () => {
    let t = 0;
    const lines: string[] = [];
    expect(restartDelay(1, fast)).toBe(20);
    expect(restartDelay(4, fast)).toBe(160);
    expect(restartDelay(30, fast)).toBe(1000);
    // The window logic: a crash older than the window no longer counts (checked through the log with a fake clock).
    const sup = supervise([nodeChild('slow', 'process.exit(2)')], { ...fast, crashLimit: 2, windowMs: 1, now: () => (t += 10), log: (l) => lines.push(l) });
    return waitFor('three restarts', async () => lines.length >= 3).then(async () => {
      await sup.stop();
      expect(lines.slice(0, 3).every((l) => l.includes('restarting in 20 ms (1 of 2'))).toBe(true);
    });
  });

  it('when npm start\'s runner gets Ctrl-C (SIGINT), then it stops every child and exits 0; a crash loop exits 1', async () => {
    const spec = path.join(dir, 'spec.json');
    writeFileSync(spec, JSON.stringify([steady(), crashesOnce(path.join(dir, 'once-b'))]));
    const run = (file: string) => {
      const p = spawn(process.execPath, ['--import', 'tsx', 'scripts/supervisor/main.ts', '--fast', '--spec', file], { stdio: ['ignore', 'pipe', 'inherit'] });
      let out = '';
      p.stdout!.on('data', (b: Buffer) => (out += b.toString()));
      const exit = new Promise<number | null>((r) => p.once('exit', (code) => r(code)));
      return { p, out: () => out, exit };
    };
    const a = run(spec);
    await waitFor('the restart line', async () => a.out().includes('flaky ended (code 3); restarting in 50 ms'), 20_000);
    a.p.kill('SIGINT');
    expect(await a.exit).toBe(0);
    expect(a.out()).toMatch(/SIGINT: stopping steady, flaky/);

    const loop = path.join(dir, 'loop.json');
    writeFileSync(loop, JSON.stringify([nodeChild('broken', 'process.exit(1)')]));
    const b = run(loop);
    expect(await b.exit).toBe(1);
    expect(b.out()).toMatch(/broken ended \(code 1\) 5 times within 60 s; stopping everything/);
  }, 40_000);
});
