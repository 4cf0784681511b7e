import { describeIssues } from './issues';
import { harvestOptionSchema } from './option';

/** OPTION.json shape checks: the messages a user reads for careless and hostile input. */

function problems(input: unknown): string[] {
  const parsed = harvestOptionSchema.safeParse(input);
  return parsed.success ? [] : describeIssues(parsed.error);
}

const option = (...adjustments: unknown[]) => ({ name: 'cut', adjustments });

describe('OPTION.json', () => {
  it('names production, not catch, for a production cut below −100 %', () => {
    expect(problems(option({ type: 'scale-production', compartment: 'algae', percent: -101 }))).toEqual([
      'adjustments[0].percent: percent must not be below -100 (production cannot fall below zero)',
    ]);
    expect(problems(option({ type: 'scale-catch', fleet: 'nets', compartment: 'bream', percent: -101 }))).toEqual([
      'adjustments[0].percent: percent must not be below -100 (a catch cannot fall below zero)',
    ]);
    expect(problems(option({ type: 'scale-production', compartment: 'algae', percent: -100 }))).toEqual([]);
  });

  it('calls 1e309 (read as Infinity) too large in percents, amounts, cv and seed', () => {
    const text = JSON.stringify({
      name: 'cut',
      adjustments: [
        { type: 'scale-catch', fleet: 'nets', compartment: 'bream', percent: 0 },
        { type: 'open-fishery', fleet: 'traps', compartment: 'bream', amount: 0 },
      ],
      uncertainty: { draws: 10, cv: 0, seed: 0 },
    });
    const infinite = (from: string, to: string) => problems(JSON.parse(text.replace(from, to)));
    expect(infinite('"percent":0', '"percent":1e309')).toEqual(['adjustments[0].percent: percent is too large (beyond ±1.8e308)']);
    expect(infinite('"amount":0', '"amount":1e309')).toEqual(['adjustments[1].amount: amount is too large (beyond ±1.8e308)']);
    expect(infinite('"cv":0', '"cv":1e309')).toEqual(['uncertainty.cv: cv is too large (beyond ±1.8e308)']);
    expect(infinite('"seed":0', '"seed":1e309')).toEqual(['uncertainty.seed: seed is too large (beyond ±1.8e308)']);
    expect(infinite('"draws":10', '"draws":1e309')).toEqual(['uncertainty.draws: draws is too large (beyond ±1.8e308)']);
  });

  it('refuses control and bidirectional characters and over-long text in names, fleets and compartments', () => {
    expect(problems({ name: 'cut\u0000', adjustments: [] })).toEqual(['name: name must not contain control characters (U+0000 at position 4)']);
    expect(problems(option({ type: 'close-fleet', fleet: 'ne\u202ets' }))).toEqual([
      'adjustments[0].fleet: fleet must not contain bidirectional formatting characters (U+202E at position 3)',
    ]);
    expect(problems(option({ type: 'scale-production', compartment: 'a'.repeat(101), percent: 5 }))).toEqual([
      'adjustments[0].compartment: compartment must be at most 100 characters',
    ]);
    expect(problems({ name: 'n'.repeat(201), adjustments: [] })).toEqual(['name: name must be at most 200 characters']);
  });

  it('keeps the uncertainty cv between 0 and 2', () => {
    const withCv = (cv: number) => problems({ name: 'x', adjustments: [], uncertainty: { draws: 1, cv, seed: 1 } });
    expect(withCv(2)).toEqual([]);
    expect(withCv(2.5)).toEqual(['uncertainty.cv: cv must be between 0 and 2']);
  });
});
