// Start-up refuses bad configuration with a list of everything that is wrong.
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadConfig, ConfigError, DEV_SESSION_SECRET } from '../../server/config/config';
import { startTestApp } from '../support/test-app';
import { startServer } from '../../server/index';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

describe('configuration', () => {
  it('collects every problem, not just the first', () => {
    try {
      loadConfig({ PORT: 'eighty', DB_PORT: '99999', SESSION_SECRET: 'short', NODE_ENV: 'staging' });
      expect.unreachable('bad configuration was accepted');
    } catch (err) {
      expect(err).toBeInstanceOf(ConfigError);
      const problems = (err as ConfigError).problems.join('\n');
      for (const key of ['PORT', 'DB_PORT', 'SESSION_SECRET', 'NODE_ENV']) expect(problems).toContain(key);
    }
  });

  it('refuses the development secret and demo seeding in production', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
    expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(32), SMTP_HOST: 'mail.example.test', DEMO_SEED: 'on' })).toThrow(/DEMO_SEED/);
    const ok = loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(32), SMTP_HOST: 'mail.example.test' });
    expect(ok.demoSeed).toBe(false);
    expect(ok.session.secret).not.toBe(DEV_SESSION_SECRET);
  });

  it('exits the server process with the list on stderr', () => {
    const result = spawnSync(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      cwd: root,
      env: { PATH: process.env.PATH, PORT: 'not-a-port', DB_POOL_MAX: '0' },
      encoding: 'utf8',
      timeout: 30_000,
    });
    expect(result.status).toBe(78);
    expect(result.stderr).toContain('Configuration is not valid');
    expect(result.stderr).toContain('PORT');
    expect(result.stderr).toContain('DB_POOL_MAX');
  });

  it('refuses to run in production while demo accounts exist', async () => {
    const app = await startTestApp(); // seeds the demo accounts into its database
    await app.server.stop();
    try {
      const cfg = app.server.config;
      await expect(
        startServer(
          { NODE_ENV: 'production', PORT: '0', DB_HOST: cfg.db.host, DB_PORT: String(cfg.db.port), DB_NAME: cfg.db.name, DB_USER: cfg.db.user, DB_PASSWORD: cfg.db.password, SESSION_SECRET: 'p'.repeat(40), SMTP_HOST: 'mail.example.test' },
          true,
        ),
      ).rejects.toThrow(/demo accounts exist/);
    } finally {
      await app.dropDatabase();
    }
  });
});
