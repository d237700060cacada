import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createKnex } from '../../backend/db/knex';
import { projectRoot } from '../../backend/paths';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'conductory-cli-'));
const databaseFile = path.join(dir, 'cli.sqlite');
const run = (...args: string[]) =>
  execFileSync(
    path.join(projectRoot, 'node_modules/.bin/tsx'),
    [path.join(projectRoot, 'scripts/user.ts'), ...args],
    {
      env: { ...process.env, DATABASE_FILE: databaseFile, NODE_ENV: 'test' },
      encoding: 'utf8',
    },
  );
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

describe('npm run user (operator CLI)', () => {
  it('creates, re-roles and disables an account in the DATABASE_FILE it is given', async () => {
    expect(
      run(
        'create',
        '--email',
        'operator@ridgeline.example',
        '--password',
        'sorting-line-secret-1',
        '--role',
        'curator',
      ),
    ).toMatch(/created/);
    expect(run('set-role', '--email', 'operator@ridgeline.example', '--role', 'admin')).toMatch(
      /now admin/,
    );
    expect(run('disable', '--email', 'operator@ridgeline.example')).toMatch(/disabled/);
    const knex = createKnex(databaseFile);
    const row = await knex('users').where({ email: 'operator@ridgeline.example' }).first();
    await knex.destroy();
    expect(row).toMatchObject({ role: 'admin', status: 'disabled' });
    expect(row.email_verified_at).not.toBeNull();
  }, 60_000);

  it('refuses a common password and an unknown role with exit code 2', () => {
    expect(() =>
      run(
        'create',
        '--email',
        'weak@ridgeline.example',
        '--password',
        'password123',
        '--role',
        'reader',
      ),
    ).toThrow(/common/);
    expect(() =>
      run(
        'create',
        '--email',
        'odd@ridgeline.example',
        '--password',
        'fine-password-22',
        '--role',
        'owner',
      ),
    ).toThrow(/--role/);
  }, 60_000);
});
