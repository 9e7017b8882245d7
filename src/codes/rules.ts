/**
 * The rules a rulebook applies around the section, and what the check finds for each: facts, not
 * sentences. Views turn a finding into words with the basis's vocabulary; no view parses a string back.
 */

/** What a finding's value and limit measure; views pick the display unit from it. */
export const FINDING_QUANTITIES = ['ratio', 'length', 'area', 'force', 'moment', 'stress', 'count'] as const;
export type FindingQuantity = (typeof FINDING_QUANTITIES)[number];

/** One rule of a basis's rulebook, with its clause and where its text comes from. */
export interface RuleDef {
  /** stable key, unique within the rulebook, e.g. 'min-moment', 'slenderness-limit', 'steel-max', 'clear-spacing' */
  readonly id: string;
  /** clause in the basis's edition, e.g. '6.6.4.5.4' */
  readonly clause: string;
  /** a short title in the basis's own words */
  readonly title: string;
  /** 'published': checked against the published clause text; 'from memory': recalled, to be confirmed */
  readonly source: 'published' | 'from memory';
}

/** What a rule did for one load (or for the column as given). */
export const FINDING_OUTCOMES = ['applied', 'met', 'violated', 'unchecked'] as const;
export type FindingOutcome = (typeof FINDING_OUTCOMES)[number];

/** One finding: the rule, its clause, the axis it concerns, and the figures compared (internal units). */
export interface RuleFinding {
  /** RuleDef.id of the rule */
  readonly rule: string;
  readonly clause: string;
  /** bending axis the finding concerns; absent for section-wide rules (steel ratio, spacing) */
  readonly axis?: 'x' | 'y';
  readonly outcome: FindingOutcome;
  /** the figure found (internal units), where the rule compares one */
  readonly value?: number | null;
  /** the limit it is compared with (internal units) */
  readonly limit?: number | null;
  readonly quantity?: FindingQuantity;
}
