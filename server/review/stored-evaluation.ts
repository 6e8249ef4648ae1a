import type { EvaluationResult } from '@shared/engine/index';

/**
 * The engine result kept on a revision. The design workspace stores `{ wire, evaluation }`; older rows and
 * test fixtures hold the evaluation itself. Both are read the same way here.
 */
export function storedEvaluation(stored: unknown): EvaluationResult | null {
  if (!stored || typeof stored !== 'object') return null;
  if ('evaluation' in stored) return ((stored as { evaluation: EvaluationResult | null }).evaluation ?? null);
  return stored as EvaluationResult;
}
