import { sortIndicators } from './indicator-rows';
import { INDICATORS } from './test-comparison';

const keys = (column: string, direction: 'asc' | 'desc' | '') => sortIndicators(INDICATORS, column, direction).map((i) => i.key);

describe('sortIndicators', () => {
  it('keeps the server order when no column is sorted', () => {
    expect(keys('', '')).toEqual(['relativeAscendency', 'totalCatch', 'tst', 'fishingInBalance']);
    expect(keys('baseline', '')).toEqual(['relativeAscendency', 'totalCatch', 'tst', 'fishingInBalance']);
  });

  it('sorts by the baseline either way, with the indicator that has none last both times', () => {
    expect(keys('baseline', 'asc')).toEqual(['relativeAscendency', 'totalCatch', 'tst', 'fishingInBalance']);
    expect(keys('baseline', 'desc')).toEqual(['tst', 'totalCatch', 'relativeAscendency', 'fishingInBalance']);
  });

  it("sorts by one run's change, signed", () => {
    expect(keys('difference:r1', 'asc')).toEqual(['totalCatch', 'fishingInBalance', 'relativeAscendency', 'tst']);
    expect(keys('difference:r2', 'desc')).toEqual(['totalCatch', 'fishingInBalance', 'relativeAscendency', 'tst']);
  });

  it('sorts by the value after an option, and by name', () => {
    expect(keys('after:r2', 'desc')).toEqual(['tst', 'totalCatch', 'relativeAscendency', 'fishingInBalance']);
    expect(keys('indicator', 'asc')).toEqual(['fishingInBalance', 'relativeAscendency', 'totalCatch', 'tst']);
  });

  it('does not change the list it was given', () => {
    const before = INDICATORS.map((i) => i.key);
    sortIndicators(INDICATORS, 'baseline', 'desc');
    expect(INDICATORS.map((i) => i.key)).toEqual(before);
  });
});
