import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** Public: the Python client (clients/python/correlary.py) holds no data; integrators download it with curl. */
export function GET() {
  const text = readFileSync(join(process.cwd(), 'clients', 'python', 'correlary.py'), 'utf8');
  return new Response(text, { headers: { 'content-type': 'text/x-python; charset=utf-8', 'content-disposition': 'attachment; filename="correlary.py"', 'cache-control': 'public, max-age=300' } });
}
