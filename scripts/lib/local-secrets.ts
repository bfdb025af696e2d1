import { existsSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import path from 'node:path';

export interface LocalSecrets {
  dbPassword: string;
  sessionSecret: string;
}

/** Secrets for the local instance, made once and kept in the git-ignored data folder. */
export function loadOrCreateSecrets(dataDir: string): LocalSecrets {
  const file = path.join(dataDir, 'local-secrets.json');
  if (existsSync(file)) return JSON.parse(readFileSync(file, 'utf8')) as LocalSecrets;
  mkdirSync(dataDir, { recursive: true });
  const secrets = { dbPassword: randomBytes(18).toString('base64url'), sessionSecret: randomBytes(32).toString('base64url') };
  writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  return secrets;
}
