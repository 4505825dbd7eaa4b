import { phaseMultiplicationLabels } from '../../../../shared/domain/planning/power-design';
import {
  formFactorLabels,
  frontUsbCHeaderLabels,
  vcoreStageTypeLabels,
  wifiGenerationLabels,
  type Features,
  type PowerDesign,
} from '../../../../shared/schemas/catalog';

const THIN = '\u2009';

/** "2.5 Gbit/s", "1 Gbit/s", "No wired LAN". */
export function formatLanSpeed(mbps: number | null): string {
  if (mbps === null) return '—';
  if (mbps === 0) return 'No wired LAN';
  if (mbps >= 1000) return `${(mbps / 1000).toLocaleString('en-GB', { maximumFractionDigits: 1 })}${THIN}Gbit/s`;
  return `${mbps}${THIN}Mbit/s`;
}

export function formatAmps(amps: number | null, digits = 0): string {
  if (amps === null) return '—';
  return `${amps.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: 1 })}${THIN}A`;
}

/**
 * Controller phases × multiplication → effective phases, e.g. "8 × 2 → 16" for doublers, "8 × 1 → 8" for a direct
 * design and "8 × 1 → 8, teamed ×2" for teamed stages, which share a phase's current but add no phase.
 */
export function formatPhases(design: PowerDesign): string {
  const { controllerPhases, phaseMultiplication, effectivePhases, stagesPerPhase } = design;
  if (controllerPhases === null) return '—';
  if (!phaseMultiplication || effectivePhases === null) return `${controllerPhases} (multiplication unknown)`;
  if (phaseMultiplication === 'doubled') return `${controllerPhases} × 2 → ${effectivePhases}`;
  if (phaseMultiplication === 'teamed') {
    return `${controllerPhases} × 1 → ${effectivePhases}, teamed ×${stagesPerPhase ?? '?'}`;
  }
  return `${controllerPhases} × 1 → ${effectivePhases}`;
}

export function phasesTitle(design: PowerDesign): string | undefined {
  if (!design.phaseMultiplication) return undefined;
  return `${phaseMultiplicationLabels[design.phaseMultiplication]}; ${design.vcoreStageCount ?? '?'} V-core stages`;
}

export function stageTypeShort(design: PowerDesign): string {
  if (!design.vcoreStageType) return '—';
  return design.vcoreStageType === 'integrated-power-stage' ? 'Power stage' : 'Discrete MOSFETs';
}

export function stageTypeLong(design: PowerDesign): string {
  return design.vcoreStageType ? vcoreStageTypeLabels[design.vcoreStageType] : '—';
}

export function formatFormFactor(formFactor: keyof typeof formFactorLabels): string {
  return formFactorLabels[formFactor];
}

/** Rear USB ports by speed, e.g. "4 × USB 2.0, 2 × 10G"; null counts are left out. */
export function formatRearUsb(rearUsb: Features['rearUsb']): string {
  const parts: string[] = [];
  const add = (count: number | null, label: string) => {
    if (count) parts.push(`${count}${THIN}×${THIN}${label}`);
  };
  add(rearUsb.usb2, 'USB 2.0');
  add(rearUsb.usb5g, '5G');
  add(rearUsb.usb10g, '10G');
  add(rearUsb.usb20g, '20G');
  add(rearUsb.usb40g, '40G');
  const known = Object.values(rearUsb).some((count) => count !== null);
  if (parts.length === 0) return known ? 'None' : '—';
  return parts.join(', ');
}

export function rearUsbTotal(rearUsb: Features['rearUsb']): number | null {
  const counts = Object.values(rearUsb).filter((count): count is number => count !== null);
  return counts.length === 0 ? null : counts.reduce((sum, count) => sum + count, 0);
}

export function formatWifi(wifi: Features['wifi']): string {
  return wifi ? wifiGenerationLabels[wifi] : '—';
}

export function formatFrontUsbC(header: Features['frontUsbCHeader']): string {
  return header ? frontUsbCHeaderLabels[header] : '—';
}

export function formatYesNo(value: boolean | null): string {
  return value === null ? '—' : value ? 'Yes' : 'No';
}

/** The features column: the handful of facts a roundup compares, in a fixed order. */
export function featureSummary(features: Features): string {
  const parts: string[] = [];
  if (features.wifi && features.wifi !== 'none') parts.push(wifiGenerationLabels[features.wifi]);
  if (features.lanSpeedMbps) parts.push(`${formatLanSpeed(features.lanSpeedMbps)} LAN`);
  if (features.m2Slots !== null) parts.push(`${features.m2Slots}${THIN}× M.2`);
  if (features.sataPorts !== null) parts.push(`${features.sataPorts}${THIN}× SATA`);
  const rear = rearUsbTotal(features.rearUsb);
  if (rear !== null) parts.push(`${rear} rear USB`);
  if (features.frontUsbCHeader && features.frontUsbCHeader !== 'none') parts.push('front USB-C');
  if (features.ioShieldPrefitted) parts.push('I/O shield fitted');
  return parts.length > 0 ? parts.join(' · ') : '—';
}
