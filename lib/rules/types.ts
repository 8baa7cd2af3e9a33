/**
 * Rule findings: what the rule checks of product design §12 return, each with where it is.
 */

export type RuleSeverity = 'error' | 'warning' | 'info';

/**
 * Where a finding is. `needle` and `course` are in the panel's stitch space (needles from the
 * panel's left edge, courses from its top) when `panelId` is set; a texture finding is placed at the
 * first stitch of the offending repeat cell inside the zone (or panel) that uses the texture.
 */
export interface FindingLocation {
  panelId?: string;
  zoneId?: string;
  course?: number;
  needle?: number;
  textureId?: string;
  yarnIds?: string[];
  trimIds?: string[];
}

export const ruleIds = [
  'unknown-texture',
  'yarn-count',
  'float-length',
  'tuck-stack',
  'zone-repeat',
  'compression-elastane',
  'dye-clash',
  'trim-heat',
  'trim-reheat',
  'trim-ventilation',
  'knitted-logo-detail',
] as const;
export type RuleId = (typeof ruleIds)[number];

export interface RuleFinding {
  rule: RuleId;
  severity: RuleSeverity;
  message: string;
  where: FindingLocation;
}

/** What the rules need of the machine setup. */
export interface RuleMachine {
  construction: 'seamless' | 'flat';
  /** Needles per inch. */
  gauge: number;
  /**
   * Distinct yarns the machine can carry for one garment. A seamless machine carries about two to
   * three yarns: common practice, no published source — set it from the machine setup.
   */
  maxYarns: number;
}

/** Studio limits for the stitch rules. */
export interface RuleLimits {
  /** Longest float accepted, mm. */
  maxFloatMm: number;
  /** Most tuck loops a needle may hold before it knits. */
  maxTuckStack: number;
}

/**
 * Default limits: floats up to 6 mm and four stacked tucks. Common practice, no published source;
 * a studio sets its own.
 */
export const defaultRuleLimits: RuleLimits = { maxFloatMm: 6, maxTuckStack: 4 };
