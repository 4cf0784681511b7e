import { TestBed } from '@angular/core/testing';
import { RunForm } from './run-form';

describe('RunForm', () => {
  it('takes the option’s settings, and keeps what was typed when the same settings arrive again', async () => {
    TestBed.configureTestingModule({ imports: [RunForm] });
    const fixture = TestBed.createComponent(RunForm);
    fixture.componentRef.setInput('defaults', { draws: 500, cv: 0.2, seed: 7 });
    fixture.detectChanges();
    await fixture.whenStable();
    const draws = () => fixture.nativeElement.querySelector('input[type=number]') as HTMLInputElement;
    expect(draws().value).toBe('500');
    draws().value = '2000';
    draws().dispatchEvent(new Event('input'));
    fixture.detectChanges();
    await fixture.whenStable();
    // the option read again after a share: a new object, the same settings
    fixture.componentRef.setInput('defaults', { draws: 500, cv: 0.2, seed: 7 });
    fixture.detectChanges();
    await fixture.whenStable();
    expect(draws().value).toBe('2000');
    // other settings (another option): taken
    fixture.componentRef.setInput('defaults', { draws: 100, cv: 0.3, seed: 8 });
    fixture.detectChanges();
    await fixture.whenStable();
    expect(draws().value).toBe('100');
  });
});
