import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { RankBy } from '@shared/engine/index';
import { trimmedNumber } from '@shared/units/index';

import { QuantityPipe } from '../units/quantity';
import type { CandidateRow } from './candidate-rows';
import { percent } from './format';
import { OBJECTIVES, objectiveOf, type Objective } from './search-objectives';

type ObjectiveColumn = Objective['column'];

/**
 * One page of ranked candidates. The columns of the four objectives rank the whole list on the server when their
 * header is pressed (ascending only: every objective is "lowest first"); the other columns keep the server's order.
 */
@Component({
  selector: 'gw-candidates-table',
  imports: [MatTableModule, NgTemplateOutlet, MatTooltipModule, QuantityPipe],
  templateUrl: './candidates-table.html',
  styleUrl: './candidates-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CandidatesTable {
  readonly rows = input.required<readonly CandidateRow[]>();
  readonly rankBy = input.required<RankBy>();
  readonly caption = input('');
  readonly selectedKey = input<string | null>(null);
  readonly rankByChange = output<RankBy>();
  readonly selectRow = output<CandidateRow>();
  readonly useRow = output<CandidateRow>();

  protected readonly columns = [
    'rank',
    'core',
    'material',
    'conductor',
    'turns',
    'gap',
    'totalLoss',
    'volume',
    'mass',
    'rise',
    'fill',
    'fluxMargin',
    'lossVolume',
    'marks',
  ];
  protected readonly activeColumn = computed(() => objectiveOf(this.rankBy()).column);
  protected readonly pct = (value: number) => percent(value, 0);
  protected readonly sig = (value: number) => trimmedNumber(value, 3);

  protected objectiveFor(column: ObjectiveColumn): Objective {
    return OBJECTIVES.find((o) => o.column === column)!;
  }

  /** What pressing the header does, said in its tooltip and to screen readers. */
  protected sortHint(column: ObjectiveColumn): string {
    const objective = this.objectiveFor(column);
    return this.activeColumn() === column
      ? `The whole list is ranked by this column: ${objective.order} (${objective.explanation.toLowerCase()}).`
      : `Rank the whole list ${objective.order}: the search runs again and the server ranks every candidate.`;
  }

  protected rankByColumn(column: ObjectiveColumn): void {
    this.rankByChange.emit(this.objectiveFor(column).value);
  }
}
