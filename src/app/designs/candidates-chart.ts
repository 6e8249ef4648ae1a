import type { EChartsCoreOption } from 'echarts/core';

import { tooltipLines } from '../charts/chart-text';
import type { CandidateRow } from './candidate-rows';
import { axisIn } from '@shared/units/index';

/** The volume axis in cm³; the panel uses it too to place the selection ring. */
export const VOLUME_AXIS = axisIn('cm³');

/** Loss against core volume of the feasible candidates: the Pareto front dashed, the selected one ringed. */
export function candidatesChartOptions(rows: readonly CandidateRow[], selectedKey: string | null): EChartsCoreOption {
  const feasible = rows.filter((r) => r.feasible);
  if (!feasible.length) return {};
  const point = (r: CandidateRow) => ({
    value: [VOLUME_AXIS.toAxis(r.volume!), r.totalLoss!],
    name: `${r.coreId} · ${r.materialName} · ${r.wireId}`,
    key: r.key,
  });
  const front = feasible.filter((r) => r.pareto).sort((a, b) => a.volume! - b.volume!);
  return {
    animation: false,
    grid: { left: 56, right: 16, top: 32, bottom: 44 },
    legend: { top: 0 },
    tooltip: { trigger: 'item', formatter: candidateTooltip },
    xAxis: { type: 'value', name: `Core volume (${VOLUME_AXIS.unit})`, nameLocation: 'middle', nameGap: 28, scale: true },
    yAxis: { type: 'value', name: 'Total loss (W)', scale: true },
    series: [
      { type: 'scatter', name: 'Candidates', data: feasible.filter((r) => !r.pareto).map(point), symbolSize: 8 },
      { type: 'line', name: 'Pareto front', data: front.map(point), symbolSize: 12, symbol: 'diamond', lineStyle: { type: 'dashed' } },
      {
        type: 'scatter',
        name: 'Selected',
        data: feasible.filter((r) => r.key === selectedKey).map(point),
        symbolSize: 18,
        symbol: 'circle',
        itemStyle: { color: 'transparent', borderWidth: 3, borderColor: '#d32f2f' },
        z: 5,
      },
    ],
  };
}

/** The tooltip of one candidate point: its core · material · wire name as text, then loss and volume. */
export function candidateTooltip(p: { name: string; value: number[] }): string {
  return tooltipLines(p.name, `${p.value[1].toFixed(3)} W, ${p.value[0].toFixed(2)} ${VOLUME_AXIS.unit}`);
}
