// Walks the audit hash chain; exits 1 and names the first broken link when tampering shows.
import { closeSequelize } from '@/lib/db/connection';
import { verifyAuditChain } from '@/lib/audit/log';

verifyAuditChain()
  .then((s) => {
    if (s.intact) console.log(`Audit chain intact: ${s.events} events.`);
    else {
      console.error(`Audit chain BROKEN${s.firstBrokenId ? ` at event ${s.firstBrokenId}` : ''}: ${s.reason} (${s.events} events read).`);
      process.exitCode = 1;
    }
  })
  .catch((err) => { console.error(err instanceof Error ? err.message : err); process.exitCode = 2; })
  .finally(() => closeSequelize());
