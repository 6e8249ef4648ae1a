// A winding sheet for a test: one evaluated design as the release would freeze it (invented order and people).
import type { EvaluationResult } from '@shared/engine/index';
import type { CoreShape, WireOption } from '@shared/engine/types';
import type { WindingSheet } from '@shared/shop/sheet';
import { buildWindingSheet } from '../../server/shop/winding-sheet.ts';

export function testSheet(
  result: EvaluationResult,
  wire: WireOption,
  core: CoreShape | undefined,
  title = 'test part',
  insulation: { required: boolean } = { required: false },
): WindingSheet {
  return buildWindingSheet({
    design: { number: 'GW-0001', title },
    revision: { revision: 1, engineVersion: 'test', inductanceTolerance: 0.1 },
    order: { number: 'BO-1', quantity: 1, releasedAt: new Date('2026-01-01T00:00:00Z') },
    author: 'erin',
    approver: 'ruth',
    result,
    core,
    wire,
    insulation,
  });
}
