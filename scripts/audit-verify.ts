// npm run audit:verify: walks the audit hash chain and re-hashes every frozen version and saved
// calculation and every evidence document a frozen version names; exits 1 and names the first broken link or every record that no longer matches.
import { closeSequelize } from '@/lib/db/connection';
import { verifyAuditChain } from '@/lib/audit/log';
import { verifyAllContent } from '@/lib/governance/content-check';

async function main() {
  const s = await verifyAuditChain();
  if (s.intact) console.log(`Audit chain intact: ${s.events} events.`);
  else {
    console.error(`Audit chain BROKEN${s.firstBrokenId ? ` at event ${s.firstBrokenId}` : ''}: ${s.reason} (${s.events} events read).`);
    process.exitCode = 1;
  }
  const c = await verifyAllContent();
  if (c.mismatches.length === 0) console.log(`Content hashes intact: ${c.versions} frozen versions, ${c.revisions} calculation revisions, ${c.attachments} evidence documents.`);
  else {
    console.error(`Content hash MISMATCH in ${c.mismatches.length} record(s): ${c.mismatches.slice(0, 20).join('; ')}`);
    process.exitCode = 1;
  }
}

main().catch((err) => { console.error(err instanceof Error ? err.message : err); process.exitCode = 2; }).finally(() => closeSequelize());
