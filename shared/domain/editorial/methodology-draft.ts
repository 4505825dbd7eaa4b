import type { BlockNode, InlineNode, WriteUpDocument } from '../../schemas/write-up-document';

// The first draft of "How we tested", written from the roundup's bench profile and load configurations so the
// writer starts from the facts the bench recorded. The writer edits it like any other section afterwards.

export interface MethodologyProfile {
  name: string;
  caseAndFans: string;
  cooler: string;
  psu: string;
  memory: string;
  /** °C */
  roomTempTargetC: number;
  /** ± °C */
  roomTempToleranceC: number;
  probeType: string;
  probePlacement: string;
  requiredSoakMinutes: number;
}

export interface MethodologyConfiguration {
  name: string;
  cpuDescription: string;
  settingsMode: string;
  fixedClockMhz: number | null;
  /** W */
  expectedPackagePowerW: number;
  /** V */
  coreVoltageV: number;
  soakMinutes: number;
}

const thin = '\u2009';
const text = (value: string): InlineNode => ({ type: 'text', text: value });
const paragraph = (value: string): BlockNode => ({ type: 'paragraph', content: [text(value)] });
const minutes = (value: number) => `${value}${thin}minute${value === 1 ? '' : 's'}`;

function configurationLine(config: MethodologyConfiguration): string {
  const settings =
    config.fixedClockMhz !== null
      ? `${config.settingsMode} settings at a fixed ${config.fixedClockMhz}${thin}MHz`
      : `${config.settingsMode} settings`;
  return (
    `${config.name}: ${config.cpuDescription}, ${settings}, about ${config.expectedPackagePowerW.toFixed(1)}${thin}W ` +
    `package power at ${config.coreVoltageV.toFixed(3)}${thin}V core, soaked for ${minutes(config.soakMinutes)}.`
  );
}

export function methodologyDraft(
  profile: MethodologyProfile | null,
  configurations: readonly MethodologyConfiguration[],
): WriteUpDocument {
  const content: BlockNode[] = [];
  if (profile) {
    content.push(
      paragraph(
        `Every board was tested on the same open bench (${profile.name}): ${profile.caseAndFans}; ` +
          `${profile.cooler} on the CPU; ${profile.psu}; ${profile.memory}.`,
      ),
      paragraph(
        `The room was held at ${profile.roomTempTargetC.toFixed(1)}${thin}°C ± ${profile.roomTempToleranceC.toFixed(1)}${thin}°C. ` +
          `${profile.probeType} probes were placed ${profile.probePlacement}. ` +
          `Each run soaked for at least ${minutes(profile.requiredSoakMinutes)} before its peak was read.`,
      ),
    );
  } else {
    content.push(paragraph('Describe the test system, the room and the probes here.'));
  }
  if (configurations.length > 0) {
    content.push({ type: 'heading', attrs: { level: 3 }, content: [text('Load configurations')] });
    content.push({
      type: 'bulletList',
      content: configurations.map((config) => ({
        type: 'listItem',
        content: [paragraph(configurationLine(config))],
      })),
    });
  }
  return { type: 'doc', content };
}
