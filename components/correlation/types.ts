import type { Definition, CheckCase } from '@/lib/engine/types';
import type { ValidationReport } from '@/lib/engine/validate';

export interface VersionDetail {
  slug: string; kind?: 'correlation' | 'template'; title: string; version: number; status: string; contentHash: string | null; frozen: boolean;
  author: string; authorId: number; createdAt: string; submittedAt: string | null; approvedAt: string | null;
  withdrawnAt: string | null; withdrawnReason: string | null;
  definition: Definition; checkCases: CheckCase[]; validation: ValidationReport | null; tex: Record<string, string>;
  signOffs: { decision: string; by: string; at: string; comment: string; meaning: string; contentHash: string | null }[];
  comments: { by: string; at: string; body: string }[];
}

export interface CorrelationSummary {
  slug: string; title: string; latestApprovedVersion: number | null;
  versions: { version: number; status: string; contentHash: string | null; author: string; authorId: number; createdAt: string; approvedAt?: string; withdrawnReason?: string | null }[];
}

export interface Viewer {
  id: number;
  roles: string[];
}
