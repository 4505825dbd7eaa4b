import { Chart as ChartJS, registerables } from 'chart.js';
import { Chart } from 'react-chartjs-2';
import type { ChartData } from '../../../../shared/domain/editorial/chart-data';
import { chartJsConfig } from '../../../../shared/domain/editorial/chart-drawing';
import { lightChartPalette } from '../../../../shared/domain/editorial/chart-palette';

// chart.js is imported here only, and this file only by the charts screen, so no other page loads chart code.
ChartJS.register(...registerables);

/**
 * A chart drawn from its data with the same configuration the server uses for its PNG: always on light paper, in both
 * themes, as readers and e-mails see it (the palette's contrast is measured against that paper).
 */
export function ChartCanvas({ chart, label }: { chart: ChartData; label: string }) {
  const config = chartJsConfig(chart, { palette: lightChartPalette, fontFamily: 'system-ui, sans-serif' });
  const count = chart.kind === 'price-scatter' ? 8 : chart.bars.length;
  const height = chart.kind === 'price-scatter' ? 420 : Math.max(220, 150 + 44 * count);
  return (
    <div className="w-full overflow-x-auto rounded-[3px] bg-[#faf8f3]" style={{ height }}>
      <div className="h-full min-w-[560px]">
        <Chart
          type={config.type}
          data={config.data}
          options={config.options}
          plugins={config.plugins}
          role="img"
          aria-label={label}
        />
      </div>
    </div>
  );
}
