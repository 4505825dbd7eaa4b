import { createCanvas } from '@napi-rs/canvas';
import { Chart, registerables } from 'chart.js';
import type { ChartData } from '../../shared/domain/editorial/chart-data';
import { chartImageSize, chartJsConfig } from '../../shared/domain/editorial/chart-drawing';
import { lightChartPalette } from '../../shared/domain/editorial/chart-palette';

Chart.register(...registerables);

export interface ChartImageSize {
  width: number;
  height: number;
}

/**
 * Draws a chart to a PNG with chart.js on a Node canvas: the light palette on paper, as reader pages and e-mails
 * show it, at 1200 × 630 unless a size is given. The reader site and the mail use this for approved charts (their
 * stored images come from EditorialService.approvedChartImages).
 */
export async function renderChartPng(chart: ChartData, size: ChartImageSize = chartImageSize): Promise<Buffer> {
  const canvas = createCanvas(size.width, size.height);
  const config = chartJsConfig(chart, {
    palette: lightChartPalette,
    fontFamily: 'DejaVu Sans, sans-serif',
    interactive: false,
  });
  // An image has no page behind it: paint the paper colour under the chart.
  config.plugins = [
    ...(config.plugins ?? []),
    {
      id: 'benchwirePaper',
      beforeDraw: (chart) => {
        chart.ctx.save();
        chart.ctx.fillStyle = lightChartPalette.background;
        chart.ctx.fillRect(0, 0, chart.width, chart.height);
        chart.ctx.restore();
      },
    },
  ];
  const instance = new Chart(canvas as unknown as HTMLCanvasElement, config);
  try {
    return await canvas.encode('png');
  } finally {
    instance.destroy();
  }
}
