import type { z } from 'zod';
import type { runAnswer, stepRecord, chainWarning } from '@/lib/api/contract';
import type { TemplateDefinition } from '@/lib/engine/template-types';

/** Answer types derived from the API's own zod schemas (never re-typed). */
export type RunAnswer = z.infer<typeof runAnswer>;
export type StepRecordView = z.infer<typeof stepRecord>;
export type ChainWarningView = z.infer<typeof chainWarning>;

export interface TemplateVersionView {
  slug: string; kind: 'template'; title: string; version: number; status: string; contentHash: string | null; author: string;
  definition: TemplateDefinition; approvedAt: string | null; withdrawnReason: string | null;
}

export interface ProjectSummary { id: number; name: string; description: string; owner: string; calculations: number; flagged: number; canEdit: boolean }
