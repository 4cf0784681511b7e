import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { CommentItem } from '@seinework/contracts';
import { CommentCard } from './comment-card';

function comment(over: Partial<CommentItem> = {}): CommentItem {
  return {
    id: 'c1',
    optionId: 'o1',
    audience: 'public',
    parentId: null,
    author: { id: 'u1', name: 'Sten Demo', role: 'stakeholder' },
    text: 'What happens to the total catch?',
    anchor: { kind: 'indicator', key: 'totalCatch' },
    hidden: false,
    hiddenReason: null,
    createdAt: '2026-12-03T12:00:00.000Z',
    editedAt: null,
    editable: false,
    ...over,
  };
}

describe('CommentCard', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [CommentCard], providers: [provideRouter([])] });
  });

  async function render(item: CommentItem, inputs: Record<string, unknown> = {}): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(CommentCard);
    fixture.componentRef.setInput('comment', item);
    fixture.componentRef.setInput('runId', 'r1');
    for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
    fixture.detectChanges();
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('links what the comment is about to that indicator on the result page', async () => {
    const link = (await render(comment())).querySelector('.about a') as HTMLAnchorElement;
    expect(link.textContent?.trim()).toBe('Total catch');
    expect(link.getAttribute('href')).toBe('/runs/r1#indicator-totalCatch');
  });

  it('shows staff and the author a hidden comment marked, with the reason on its own (no doubled full stop)', async () => {
    const element = await render(comment({ hidden: true, hiddenReason: 'Names a private person.' }));
    const mark = element.querySelector('[role="note"]')!.textContent!.replace(/\s+/g, ' ').trim();
    expect(mark).toContain('Hidden by staff: only its author and staff see it.');
    expect(mark).toContain('Reason: Names a private person.');
    expect(mark).not.toContain('..');
    expect(element.textContent).toContain('What happens to the total catch?');
  });

  it('shows others only a placeholder of a hidden comment', async () => {
    const element = await render(comment({ hidden: true, text: null, anchor: null }));
    expect(element.querySelector('[role="note"]')!.textContent).toContain('This comment was hidden by staff.');
    expect(element.textContent).not.toContain('Reason');
    expect(element.querySelector('.about')).toBeNull();
  });

  it('marks the discussion a comment belongs to only when the page shows two', async () => {
    expect((await render(comment())).querySelector('.badge')).toBeNull();
    TestBed.resetTestingModule();
    TestBed.configureTestingModule({ imports: [CommentCard], providers: [provideRouter([])] });
    const council = await render(comment({ audience: 'council' }), { showAudience: true });
    expect(council.querySelector('.badge')!.textContent!.trim()).toBe('Council review');
  });
});
