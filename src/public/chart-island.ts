/**
 * The reader pages' only script, plain TypeScript (no framework): switches °C/°F in place and draws each results
 * chart with chart.js on top of the server-rendered table. Everything it shows is already in the page without it.
 */
import { formatTemperature, parseDisplayUnit, type DisplayUnit } from '../../shared/domain/reader/temperature-display';

const unitCookie = 'bw_unit';
const colours = { copper: '#A4521F', slate: '#6B7A8F', red: '#B42318', ink: '#1B2433', paper: '#FAF8F3' };

interface Bar {
  name: string;
  valueC: number;
  toleranceC: number | null;
  throttled: boolean;
  reference: boolean;
  provisional: boolean;
}

function currentUnit(): DisplayUnit {
  return parseDisplayUnit(document.documentElement.dataset.unit) ?? 'C';
}

function rewriteTemperatures(unit: DisplayUnit) {
  for (const element of document.querySelectorAll<HTMLElement | SVGElement>('.temp[data-c]')) {
    const celsius = Number(element.dataset.c);
    if (!Number.isFinite(celsius)) continue;
    element.textContent = formatTemperature(
      celsius,
      unit,
      element.dataset.kind === 'difference' ? 'difference' : 'absolute',
    );
  }
}

const redraws: Array<() => void> = [];

function switchUnit(unit: DisplayUnit) {
  document.documentElement.dataset.unit = unit;
  document.cookie = `${unitCookie}=${unit}; Path=/; Max-Age=${365 * 24 * 3600}; SameSite=Lax`;
  rewriteTemperatures(unit);
  for (const link of document.querySelectorAll<HTMLAnchorElement>('.unit-option')) {
    if (link.dataset.unit === unit) link.setAttribute('aria-current', 'true');
    else link.removeAttribute('aria-current');
  }
  // Forms keep the choice when submitted; the address keeps it for sharing.
  for (const input of document.querySelectorAll<HTMLInputElement>('input[name="unit"][type="hidden"]'))
    input.value = unit;
  const url = new URL(window.location.href);
  url.searchParams.set('unit', unit);
  window.history.replaceState(null, '', url);
  for (const redraw of redraws) redraw();
}

function readBars(figure: HTMLElement): Bar[] {
  return [...figure.querySelectorAll<HTMLTableRowElement>('tbody tr')]
    .filter((row) => row.dataset.valueC !== '')
    .map((row) => ({
      name: row.dataset.name ?? '',
      valueC: Number(row.dataset.valueC),
      toleranceC: row.dataset.toleranceC ? Number(row.dataset.toleranceC) : null,
      throttled: row.dataset.throttled === 'true',
      reference: row.dataset.reference === 'true',
      provisional: row.dataset.provisional === 'true',
    }));
}

/** Red with white diagonal lines: throttled runs are marked by pattern and label, not by colour alone. */
function hatchPattern(context: CanvasRenderingContext2D): CanvasPattern | string {
  const tile = document.createElement('canvas');
  tile.width = 8;
  tile.height = 8;
  const pen = tile.getContext('2d');
  if (!pen) return colours.red;
  pen.fillStyle = colours.red;
  pen.fillRect(0, 0, 8, 8);
  pen.strokeStyle = '#FFFFFF';
  pen.lineWidth = 2;
  pen.beginPath();
  pen.moveTo(-2, 10);
  pen.lineTo(10, -2);
  pen.moveTo(-2, 2);
  pen.lineTo(2, -2);
  pen.moveTo(6, 10);
  pen.lineTo(10, 6);
  pen.stroke();
  return context.createPattern(tile, 'repeat') ?? colours.red;
}

async function drawCharts(figures: HTMLElement[]) {
  const { Chart, BarController, BarElement, CategoryScale, LinearScale, Tooltip } = await import('chart.js');
  Chart.register(BarController, BarElement, CategoryScale, LinearScale, Tooltip);
  for (const figure of figures) {
    const bars = readBars(figure);
    const area = figure.querySelector<HTMLElement>('.chart-area');
    if (!area || bars.length === 0) continue;
    const kind = figure.dataset.metric === 'over-ambient' ? 'difference' : 'absolute';
    const title = figure.querySelector('h2, h3')?.textContent ?? 'Results chart';
    const canvas = document.createElement('canvas');
    canvas.setAttribute('role', 'img');
    canvas.setAttribute('aria-label', `${title}. The table below gives every figure.`);
    canvas.height = 60 + bars.length * 34;
    area.append(canvas);
    area.classList.add('js-chart');
    const context = canvas.getContext('2d');
    if (!context) continue;
    const hatch = hatchPattern(context);
    const shown = (celsius: number, unit: DisplayUnit) =>
      kind === 'absolute'
        ? unit === 'F'
          ? (celsius * 9) / 5 + 32
          : celsius
        : unit === 'F'
          ? (celsius * 9) / 5
          : celsius;
    const label = (bar: Bar) =>
      `${formatTemperature(bar.valueC, currentUnit(), kind)}${bar.throttled ? ' throttled' : bar.provisional ? ' provisional' : ''}`;
    const chart = new Chart(context, {
      type: 'bar',
      data: {
        labels: bars.map((bar) => bar.name),
        datasets: [
          {
            data: bars.map((bar) => shown(bar.valueC, currentUnit())),
            backgroundColor: bars.map((bar) =>
              bar.throttled ? hatch : bar.reference ? colours.slate : colours.copper,
            ),
            borderColor: bars.map((bar) => (bar.throttled ? colours.red : 'transparent')),
            borderWidth: 1,
            barThickness: 22,
          },
        ],
      },
      options: {
        indexAxis: 'y',
        responsive: true,
        maintainAspectRatio: false,
        animation: false,
        layout: { padding: { right: 180 } },
        scales: {
          x: { beginAtZero: true, grid: { color: '#E4DFD3' }, ticks: { color: colours.ink } },
          y: { grid: { display: false }, ticks: { color: colours.ink, font: { size: 13 } } },
        },
        plugins: {
          tooltip: { callbacks: { label: (item) => label(bars[item.dataIndex]) } },
        },
      },
      plugins: [
        {
          id: 'value-labels-and-tolerance',
          afterDatasetsDraw(instance) {
            const pen = instance.ctx;
            const meta = instance.getDatasetMeta(0);
            const scale = instance.scales.x;
            pen.save();
            pen.font = '13px "Spline Sans Mono Variable", monospace';
            pen.fillStyle = colours.ink;
            pen.strokeStyle = colours.ink;
            pen.lineWidth = 1.5;
            pen.textBaseline = 'middle';
            meta.data.forEach((element, index) => {
              const bar = bars[index];
              const { x, y } = element.getProps(['x', 'y'], true) as { x: number; y: number };
              let end = x;
              if (bar.toleranceC !== null) {
                const unitFactor = currentUnit() === 'F' ? 9 / 5 : 1;
                const half = scale.getPixelForValue(bar.toleranceC * unitFactor) - scale.getPixelForValue(0);
                pen.beginPath();
                pen.moveTo(x - half, y);
                pen.lineTo(x + half, y);
                pen.moveTo(x - half, y - 5);
                pen.lineTo(x - half, y + 5);
                pen.moveTo(x + half, y - 5);
                pen.lineTo(x + half, y + 5);
                pen.stroke();
                end = x + half;
              }
              pen.fillText(label(bar), end + 6, y);
            });
            pen.restore();
          },
        },
      ],
    });
    area.style.height = `${canvas.height}px`;
    redraws.push(() => {
      chart.data.datasets[0].data = bars.map((bar) => shown(bar.valueC, currentUnit()));
      chart.update();
    });
  }
}

function start() {
  for (const link of document.querySelectorAll<HTMLAnchorElement>('.unit-option')) {
    link.addEventListener('click', (event) => {
      const unit = parseDisplayUnit(link.dataset.unit);
      if (!unit || event.metaKey || event.ctrlKey || event.shiftKey) return;
      event.preventDefault();
      switchUnit(unit);
    });
  }
  const figures = [...document.querySelectorAll<HTMLElement>('figure[data-chart="results"]')];
  if (figures.length > 0) void drawCharts(figures);
}

if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', start);
else start();
