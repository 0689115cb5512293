/**
 * `npm run admin -- <e-mail> ["<name>"]`: makes a site admin, once, without a known password.
 * A new account gets a random password nobody learns and this prints a one-time link (valid 24 h)
 * to choose one; an existing account just becomes admin and keeps its password. Uses DATABASE_URL,
 * or the local cluster under .data/ as `npm start` does. The link is printed on this terminal only.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { emailSchema } from '#shared/schemas/account';
import { connectDatabase } from '#server/db/client';
import { FIRST_ADMIN_LINK_MINUTES, makeSiteAdmin } from '#server/services/admins';
import { prepareDatabase } from './lib/database';
import { SetupError } from './lib/postgres';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

async function main() {
  const [emailArg, ...nameParts] = process.argv.slice(2);
  const email = emailSchema.safeParse(emailArg ?? '');
  if (!email.success) {
    console.error('Usage: npm run admin -- <e-mail> ["<name>"]   (the e-mail address is missing or not an address)');
    process.exit(2);
  }
  const name = nameParts.join(' ').trim() || 'Site admin';
  const url = await prepareDatabase(root, {});
  const database = connectDatabase(url, { max: 1 });
  try {
    const { created, token } = await makeSiteAdmin(database.db, email.data, name);
    const publicUrl = (process.env.PUBLIC_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`).replace(/\/$/, '');
    if (created) {
      console.log(
        `${email.data} is now a site admin. Open this link within ${FIRST_ADMIN_LINK_MINUTES / 60} hours to choose the password (it works once):\n\n  ${publicUrl}/reset-password?token=${token}\n`,
      );
    } else {
      console.log(`${email.data} already had an account; it is now a site admin and keeps its password.`);
    }
  } finally {
    await database.pool.end();
  }
}

main().catch((err) => {
  console.error(err instanceof SetupError ? `[setup] ${err.message}` : err);
  process.exit(1);
});
