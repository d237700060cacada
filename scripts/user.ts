/**
 * The operator's command line for accounts (honours DATABASE_URL, else DATABASE_FILE):
 *   npm run user -- create --email E --password P --role R [--name N]
 *   npm run user -- disable --email E
 *   npm run user -- set-role --email E --role R
 * Accounts made here are verified at once: the operator vouches for the address.
 */
import { parseArgs } from 'node:util';
import { hashPassword, passwordProblem } from '../backend/auth/passwords';
import { isRole } from '../backend/auth/roles';
import { readConfig } from '../backend/config';
import { createAccountRepositories } from '../backend/db/account-repositories';
import { createKnex } from '../backend/db/knex';
import { prepareDatabase } from '../backend/db/prepare';

const [command, ...rest] = process.argv.slice(2);
const { values } = parseArgs({
  args: rest,
  options: {
    email: { type: 'string' },
    password: { type: 'string' },
    role: { type: 'string' },
    name: { type: 'string' },
  },
});

function fail(message: string): never {
  console.error(`user ${command ?? ''}: ${message}`);
  process.exit(2);
}

const config = readConfig();
const knex = createKnex(config.databaseUrl ?? config.databaseFile);
try {
  await prepareDatabase(knex, { demo: false });
  const repos = createAccountRepositories(knex);
  if (!values.email) fail('--email is required');
  const existing = await repos.users.byEmail(values.email);
  switch (command) {
    case 'create': {
      if (existing) fail(`${values.email} already has an account`);
      if (!values.password) fail('--password is required');
      const problem = passwordProblem(values.password);
      if (problem) fail(`password refused: ${problem}`);
      if (!isRole(values.role)) fail('--role must be reader, integrator, curator or admin');
      const id = await repos.users.create({
        email: values.email,
        name: values.name ?? values.email.split('@')[0]!,
        passwordHash: await hashPassword(values.password),
        role: values.role,
        verified: true,
      });
      await repos.audit.record({
        actorUserId: null,
        action: 'user.created-by-cli',
        target: `user:${id}`,
        detail: { role: values.role },
      });
      console.log(`created ${values.email} (${values.role}), id ${id}`);
      break;
    }
    case 'disable': {
      if (!existing) fail(`no account ${values.email}`);
      await repos.users.update(existing.id, { status: 'disabled' });
      await repos.sessions.revokeAllFor(existing.id);
      await repos.keys.revokeAllFor(existing.id);
      await repos.audit.record({
        actorUserId: null,
        action: 'user.disabled-by-cli',
        target: `user:${existing.id}`,
      });
      console.log(`disabled ${values.email}; its sessions and keys are revoked`);
      break;
    }
    case 'set-role': {
      if (!existing) fail(`no account ${values.email}`);
      if (!isRole(values.role)) fail('--role must be reader, integrator, curator or admin');
      await repos.users.update(existing.id, { role: values.role });
      await repos.sessions.revokeAllFor(existing.id);
      await repos.audit.record({
        actorUserId: null,
        action: 'user.role-changed-by-cli',
        target: `user:${existing.id}`,
        detail: { from: existing.role, to: values.role },
      });
      console.log(`${values.email} is now ${values.role}; its sessions are ended`);
      break;
    }
    default:
      fail('use create, disable or set-role');
  }
} finally {
  await knex.destroy();
}
