import { NextResponse, type NextRequest } from 'next/server';
import { openApiDocument } from '@/lib/api/openapi';

/** Public: the API description itself holds no data. */
export function GET(req: NextRequest) {
  return NextResponse.json(openApiDocument(process.env.NEXTAUTH_URL ?? req.nextUrl.origin));
}
