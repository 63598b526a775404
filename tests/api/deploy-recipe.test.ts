import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { envSchema, parseEnv } from '../../server/env';
import { ENTRY_POINTS } from '../../scripts/build/entry-points';

// The production recipe in deploy/: systemd units that start the compiled entry points, restart on failure and
// read one environment file, and that file's example, which must name only real settings and be accepted as a
// production configuration once its placeholders are filled in.
const DIR = path.resolve('deploy/systemd');
const units = readdirSync(DIR).filter((f) => /\.(service|target)$/.test(f));
const read = (f: string) => readFileSync(path.join(DIR, f), 'utf8');
const value = (text: string, key: string) => [...text.matchAll(new RegExp(`^${key}=(.*)$`, 'gm'))].map((m) => m[1]!.trim());

function parseEnvFile(text: string): Record<string, string> {
  return Object.fromEntries(text.split('\n').filter((l) => /^[A-Z_]+=/.test(l)).map((l) => [l.slice(0, l.indexOf('=')), l.slice(l.indexOf('=') + 1)]));
}

describe('systemd units', () => {
  it('when each process unit is read, then it starts a compiled entry point with node, restarts on failure and reads the environment file', () => {
    const built = Object.keys(ENTRY_POINTS).map((k) => `dist/${k}.js`);
    const processes = units.filter((u) => u.endsWith('.service'));
    expect(processes.sort()).toEqual(['nestflow-api@.service', 'nestflow-migrate.service', 'nestflow-worker@.service']);
    for (const unit of processes) {
      const text = read(unit);
      const [exec] = value(text, 'ExecStart');
      expect(exec, unit).toMatch(/^\/usr\/bin\/node --enable-source-maps dist\/\S+\.js$/);
      expect(built, unit).toContain(exec!.split(' ').at(-1));
      expect(value(text, 'EnvironmentFile'), unit).toEqual(['/etc/nestflow/nestflow.env']);
      expect(value(text, 'Environment'), unit).toContain('NODE_ENV=production');
      expect(value(text, 'User'), unit).toEqual(['nestflow']);
    }
    for (const unit of ['nestflow-api@.service', 'nestflow-worker@.service']) {
      expect(value(read(unit), 'Restart'), unit).toEqual(['on-failure']);
      expect(value(read(unit), 'KillSignal'), unit).toEqual(['SIGTERM']);
    }
    expect(value(read('nestflow-api@.service'), 'Environment')).toContain('PORT=%i');
    expect(value(read('nestflow-migrate.service'), 'Type')).toEqual(['oneshot']);
  });

  it.skipIf(!existsSync('/usr/bin/systemd-analyze'))('when systemd-analyze verifies the units (as instances), then it reports nothing', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'nestflow-units-'));
    try {
      const names = units.map((u) => u.replace('@.', u.includes('api') ? '@3001.' : '@1.'));
      units.forEach((u, i) => copyFileSync(path.join(DIR, u), path.join(dir, names[i]!)));
      const run = spawnSync('systemd-analyze', ['verify', '--man=no', ...names.map((n) => `./${n}`)], { cwd: dir, encoding: 'utf8' });
      // Unknown keys and misplaced settings are warnings on stderr with exit 0, so any output counts as a failure.
      expect(`${run.stdout}${run.stderr}`.trim()).toBe('');
      expect(run.status).toBe(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('the environment file example', () => {
  const example = parseEnvFile(readFileSync('deploy/nestflow.env.example', 'utf8'));

  it('when its variables are compared with the settings Nestflow reads, then each is a real setting', () => {
    const known = Object.keys(envSchema.shape);
    expect(Object.keys(example).filter((k) => !known.includes(k))).toEqual([]);
    expect(Object.keys(example).length).toBeGreaterThan(15);
  });

  it('when it is loaded as a production configuration, then it is accepted as it stands (placeholders are flagged by the operator, not by the format)', () => {
    const result = parseEnv({ ...example, NODE_ENV: 'production', PORT: '3001' });
    expect(result.problems).toBeUndefined();
    expect(result.env).toMatchObject({ COOKIE_SECURE: true, TRUST_PROXY: true, SMTP_PORT: 587, SMS_API_BASE: '', MAIL_SEARCH_URL: '' });
  });
});

describe('npm run build', () => {
  it('when the package scripts are read, then build compiles the server after the web app and migrate/start run the compiled files', () => {
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { scripts: Record<string, string> };
    expect(pkg.scripts.build).toBe('vite build && node --import tsx scripts/build/server.ts');
    expect(pkg.scripts.migrate).toBe('node dist/server/migrate.js');
    expect(pkg.scripts['start:api']).toContain('dist/server/main.js');
    expect(pkg.scripts['start:worker']).toContain('dist/worker/main.js');
  });
});
