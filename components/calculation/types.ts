import type { TemplateDefinition } from '@/lib/engine/template-types';
import type { ApiAnswer } from '@/lib/client/typed';

/** Answer types generated from the API description (lib/client/api-types.ts; never re-typed). */
export type RunAnswer = ApiAnswer<'/api/templates/{slug}/run', 'post'>;
export type StepRecordView = NonNullable<RunAnswer['steps']>[number];
export type ChainWarningView = StepRecordView['warnings'][number];

export interface TemplateVersionView {
  slug: string; kind: 'template'; title: string; version: number; status: string; contentHash: string | null; author: string;
  definition: TemplateDefinition; approvedAt: string | null; withdrawnReason: string | null;
}

export interface ProjectSummary { id: number; name: string; description: string; owner: string; calculations: number; flagged: number; canEdit: boolean }
