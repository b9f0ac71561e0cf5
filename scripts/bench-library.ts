// Fills the benchmark database ($DB_BENCH_NAME, set by scripts/bench-api.sh) up to BENCH_LIBRARY_SIZE correlations
// (5,000 by default) for the library cases of npm run bench:api. Each added entry is a copy of an approved standard
// correlation under a new slug and title, with its approved version, definition, content hash and check cases, so
// the list, search and detail queries meet what they would in a large library. Refuses any other database.
import { QueryTypes } from 'sequelize';
import { closeSequelize, getSequelize } from '@/lib/db/connection';

const SIZE = Math.max(0, Math.min(100_000, Number(process.env.BENCH_LIBRARY_SIZE ?? 5000)));
const BATCH = 500;

async function main() {
  const name = process.env.DB_NAME;
  if (!name || name !== process.env.DB_BENCH_NAME) throw new Error(`refusing to add benchmark entries to "${name}": run through npm run bench:api`);
  const sequelize = getSequelize();
  const [{ n }] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM correlations WHERE kind = 'correlation'", { type: QueryTypes.SELECT });
  let have = Number(n);
  if (have >= SIZE) { console.log(`benchmark library: ${have} correlations`); return; }
  const originals = await sequelize.query<{ id: number; slug: string }>(
    `SELECT c.id, c.slug FROM correlations c JOIN correlation_versions v ON v.correlation_id = c.id AND v.status = 'approved'
      WHERE c.kind = 'correlation' AND c.slug NOT LIKE '%-copy-%' ORDER BY c.id`, { type: QueryTypes.SELECT });
  if (!originals.length) throw new Error('no approved correlations to copy: seed the benchmark database first');
  let copy = Number((await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM correlations WHERE slug LIKE '%-copy-%'", { type: QueryTypes.SELECT }))[0].n);
  while (have < SIZE) {
    const take = Math.min(BATCH, SIZE - have);
    const picks = Array.from({ length: take }, (_, i) => ({ original: originals[(copy + i) % originals.length], k: copy + i + 1 }));
    await sequelize.transaction(async (transaction) => {
      for (const { original, k } of picks) {
        const suffix = `-copy-${k}`;
        const [c] = await sequelize.query<{ id: number }>(
          `INSERT INTO correlations (slug, title, category, situation, tags, owner_id, created_at, updated_at, kind)
           SELECT CONCAT(LEFT(slug, ${100 - suffix.length}), ?), LEFT(CONCAT(title, ' (copy ${k})'), 200), category, situation, tags, owner_id, NOW(3), NOW(3), kind
             FROM correlations WHERE id = ? RETURNING id`, { replacements: [suffix, original.id], transaction, type: QueryTypes.SELECT });
        const [v] = await sequelize.query<{ id: number }>(
          `INSERT INTO correlation_versions (correlation_id, version, status, definition, content_hash, author_id, submitted_at, approved_at, approved_by_id, created_at, updated_at, evidence_grade)
           SELECT ?, 1, 'approved', definition, content_hash, author_id, submitted_at, approved_at, approved_by_id, NOW(3), NOW(3), evidence_grade
             FROM correlation_versions WHERE correlation_id = ? AND status = 'approved' RETURNING id`, { replacements: [c.id, original.id], transaction, type: QueryTypes.SELECT });
        await sequelize.query(
          `INSERT INTO check_cases (version_id, position, label, body)
           SELECT ?, cc.position, cc.label, cc.body FROM check_cases cc
             JOIN correlation_versions v ON v.id = cc.version_id WHERE v.correlation_id = ? AND v.status = 'approved'`, { replacements: [v.id, original.id], transaction });
      }
    });
    have += take;
    copy += take;
  }
  console.log(`benchmark library: ${have} correlations`);
}

main()
  .catch((err) => { console.error(`bench-library: ${err instanceof Error ? err.message : err}`); process.exitCode = 1; })
  .finally(() => closeSequelize());
