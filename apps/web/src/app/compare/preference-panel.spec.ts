import { TestBed } from '@angular/core/testing';
import type { PreferenceSummary } from '@seinework/contracts';
import { PreferencePanel } from './preference-panel';

const runs = [
  { runId: 'r1', letter: 'A', optionId: 'o1', optionName: 'Cut the forage-fish quota' },
  { runId: 'r2', letter: 'B', optionId: 'o2', optionName: 'Close the gillnets' },
];
const preference: PreferenceSummary = { id: 'p1', optionId: 'o2', optionName: 'Close the gillnets', member: 'Cole', reason: 'Fewer seabirds caught.', createdAt: '2026-03-04T10:00:00Z' };

describe('PreferencePanel', () => {
  async function open(canRecord: boolean, preferences: PreferenceSummary[] = []) {
    TestBed.configureTestingModule({ imports: [PreferencePanel] });
    const fixture = TestBed.createComponent(PreferencePanel);
    fixture.componentRef.setInput('runs', runs);
    fixture.componentRef.setInput('preferences', preferences);
    fixture.componentRef.setInput('canRecord', canRecord);
    const recorded: { optionId: string; reason: string }[] = [];
    fixture.componentInstance.record.subscribe((choice) => recorded.push(choice));
    fixture.detectChanges();
    await fixture.whenStable();
    return { fixture, root: fixture.nativeElement as HTMLElement, recorded };
  }

  it('lists who prefers which option, why and when', async () => {
    const { root } = await open(false, [preference]);
    const item = root.querySelector('ul.preferences li')!.textContent!.replace(/\s+/g, ' ');
    expect(item).toContain('Cole prefers option B, Close the gillnets');
    expect(item).toContain('Fewer seabirds caught.');
    expect(item).toContain('4 Mar 2026');
    expect(root.querySelector('form')).toBeNull();
  });

  it('asks for an option and a reason before it records anything', async () => {
    const { fixture, root, recorded } = await open(true);
    const submit = () => {
      root.querySelector('form')!.dispatchEvent(new Event('submit'));
      fixture.detectChanges();
    };
    submit();
    expect(recorded).toEqual([]);
    expect(root.textContent).toContain('Choose the option you prefer.');
    (root.querySelectorAll<HTMLInputElement>('input[type=radio]')[1]).click();
    const reason = root.querySelector('textarea')!;
    reason.value = '   ';
    reason.dispatchEvent(new Event('input'));
    submit();
    expect(recorded).toEqual([]);
    reason.value = '  Fewer seabirds caught. ';
    reason.dispatchEvent(new Event('input'));
    submit();
    expect(recorded).toEqual([{ optionId: 'o2', reason: 'Fewer seabirds caught.' }]);
    expect(reason.getAttribute('maxlength')).toBe('4000');
  });

  it('shows why the server refused, and starts afresh once a preference is stored', async () => {
    const { fixture, root } = await open(true);
    fixture.componentRef.setInput('error', 'Your preference was not recorded: reason must not be empty');
    fixture.detectChanges();
    expect(root.querySelector('[role=alert]')!.textContent).toContain('reason must not be empty');
    const reason = root.querySelector('textarea')!;
    reason.value = 'Because.';
    reason.dispatchEvent(new Event('input'));
    fixture.componentRef.setInput('error', null);
    fixture.componentRef.setInput('recorded', 'o2');
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
    expect(root.querySelector('[role=status]')!.textContent).toContain('Your preference was recorded.');
    expect(root.querySelector('textarea')!.value).toBe('');
  });
});
