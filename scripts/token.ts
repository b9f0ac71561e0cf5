// npm run token -- create --email someone@example.com --name "sizing script" [--scopes read,evaluate] [--days 90]
// Prints the new token alone on the last line (it is shown once; only its hash is stored).
import { parseArgs } from 'node:util';
import { closeSequelize } from '@/lib/db/connection';
import { db } from '@/models';
import { createApiToken, TOKEN_SCOPES, type TokenScope } from '@/lib/api/tokens';

async function main() {
  const { positionals, values } = parseArgs({
    allowPositionals: true,
    options: { email: { type: 'string' }, name: { type: 'string' }, scopes: { type: 'string', default: 'read,evaluate' }, days: { type: 'string' } },
  });
  if (positionals[0] !== 'create') throw new Error('usage: npm run token -- create --email … --name … [--scopes read,evaluate] [--days N]');
  if (!values.email || !values.name) throw new Error('--email and --name are required');
  const scopes = values.scopes!.split(',').map((s) => s.trim()) as TokenScope[];
  const bad = scopes.filter((s) => !TOKEN_SCOPES.includes(s));
  if (bad.length) throw new Error(`unknown scope(s): ${bad.join(', ')} (allowed: ${TOKEN_SCOPES.join(', ')})`);
  const days = values.days ? Number(values.days) : null;
  if (days !== null && !(Number.isInteger(days) && days > 0)) throw new Error('--days must be a positive whole number');
  const { User } = db();
  const user = await User.findOne({ where: { email: values.email.toLowerCase() } });
  if (!user) throw new Error(`no user with e-mail ${values.email}`);
  const t = await createApiToken({ actorId: null, userId: user.id, name: values.name, scopes, expiresAt: days ? new Date(Date.now() + days * 86_400_000) : null });
  console.log(`Created token "${t.name}" (${t.prefix}…) for ${user.email} with scopes ${scopes.join(', ')}${days ? `, expiring in ${days} days` : ''}.`);
  console.log(t.token);
}

main().catch((err) => { console.error(err instanceof Error ? err.message : err); process.exitCode = 1; }).finally(() => closeSequelize());
