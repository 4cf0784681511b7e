import { TestBed } from '@angular/core/testing';
import { IndicatorTable } from './indicator-table';
import { INDICATORS } from './test-comparison';

const runs = [
  { runId: 'r1', letter: 'A', optionId: 'o1', optionName: 'Cut the forage-fish quota' },
  { runId: 'r2', letter: 'B', optionId: 'o2', optionName: 'Close the gillnets' },
];

describe('IndicatorTable', () => {
  async function open() {
    TestBed.configureTestingModule({ imports: [IndicatorTable] });
    const fixture = TestBed.createComponent(IndicatorTable);
    fixture.componentRef.setInput('indicators', INDICATORS);
    fixture.componentRef.setInput('runs', runs);
    fixture.detectChanges();
    await fixture.whenStable();
    const root: HTMLElement = fixture.nativeElement;
    const names = () => Array.from(root.querySelectorAll('tbody tr td:first-child')).map((td) => td.textContent!.trim());
    const header = (text: string) =>
      Array.from(root.querySelectorAll<HTMLElement>('th[mat-sort-header]')).find((th) => th.textContent!.replace(/\s+/g, ' ').trim() === text)!;
    return { fixture, root, names, header };
  }

  it('shows the baseline, then each option after and its change with the band', async () => {
    const { root } = await open();
    const groups = Array.from(root.querySelectorAll('tr.group-row th')).map((th) => th.textContent!.trim());
    expect(groups).toEqual(['Indicator and baseline', 'Option A: Cut the forage-fish quota', 'Option B: Close the gillnets']);
    const catchRow = Array.from(root.querySelectorAll('tbody tr')).find((tr) => tr.textContent!.includes('Total catch'))!;
    const cells = Array.from(catchRow.querySelectorAll('td')).map((td) => td.textContent!.replace(/\s+/g, ' ').trim());
    expect(cells[1]).toBe('3.35');
    expect(cells[2]).toBe('2.87');
    expect(cells[3]).toContain('−0.48');
    expect(cells[3]).toContain('−0.56 to −0.4');
  });

  it("gives each indicator its unit once the web's flow unit is known", async () => {
    const { fixture, root } = await open();
    const unitOfRow = (name: string) => Array.from(root.querySelectorAll('tbody tr')).find((tr) => tr.textContent!.includes(name))!.querySelector('.unit')?.textContent;
    expect(unitOfRow('Total catch')).toBeUndefined();
    fixture.componentRef.setInput('flowUnit', 'g C m-2 y-1');
    fixture.detectChanges();
    expect(unitOfRow('Total catch')).toBe('g C m-2 y-1');
    expect(unitOfRow('Relative ascendency')).toBeUndefined();
  });

  it('marks with an icon and words exactly the changes whose band excludes zero, and explains the mark', async () => {
    const { root } = await open();
    const marked = Array.from(root.querySelectorAll('tbody td'))
      .filter((td) => td.querySelector('.mark'))
      .map((td) => td.querySelector('.difference')!.textContent!.trim());
    // relative ascendency A, total catch A and B, throughput A; not relative ascendency B, throughput B or Fishing-in-Balance
    expect(marked).toEqual(['+0.0002', '−0.48', '+0.11', '+0.35']);
    for (const mark of Array.from(root.querySelectorAll('tbody .mark'))) {
      expect(mark.querySelector('mat-icon')!.textContent).toBe('flag');
      expect(mark.textContent).toContain('exceeds uncertainty');
    }
    expect(root.querySelector('#exceeds-legend')!.textContent).toContain('means the whole 5–95 % band of the difference lies on one side of zero');
    expect(root.querySelector('table')!.getAttribute('aria-describedby')).toBe('exceeds-legend');
    const fib = Array.from(root.querySelectorAll('tbody tr')).find((tr) => tr.textContent!.includes('Fishing-in-Balance'))!;
    expect(fib.textContent).toContain('no band');
  });

  it('sorts by a column heading: ascending, descending, then back to the server order', async () => {
    const { fixture, names, header } = await open();
    expect(names()).toEqual(['Relative ascendency', 'Total catch', 'Total system throughput', 'Fishing-in-Balance']);
    const change = header('Change, 5–95 % band option B');
    change.click();
    fixture.detectChanges();
    expect(names()).toEqual(['Total system throughput', 'Relative ascendency', 'Fishing-in-Balance', 'Total catch']);
    expect(change.getAttribute('aria-sort')).toBe('ascending');
    change.click();
    fixture.detectChanges();
    expect(names()).toEqual(['Total catch', 'Fishing-in-Balance', 'Relative ascendency', 'Total system throughput']);
    change.click();
    fixture.detectChanges();
    expect(names()).toEqual(['Relative ascendency', 'Total catch', 'Total system throughput', 'Fishing-in-Balance']);
    header('Baseline').click();
    fixture.detectChanges();
    expect(names().at(-1)).toBe('Fishing-in-Balance');
    expect(names()[0]).toBe('Relative ascendency');
  });
});
