import { TestBed } from '@angular/core/testing';
import { CommentText, linkPieces } from './comment-text';

describe('linkPieces', () => {
  it('makes http and https addresses links and leaves trailing punctuation out', () => {
    expect(linkPieces('See https://example.org/report. And http://a.test/x?y=1, too')).toEqual([
      { kind: 'text', text: 'See ' },
      { kind: 'link', text: 'https://example.org/report', href: 'https://example.org/report' },
      { kind: 'text', text: '. And ' },
      { kind: 'link', text: 'http://a.test/x?y=1', href: 'http://a.test/x?y=1' },
      { kind: 'text', text: ', too' },
    ]);
  });

  it('never links other schemes', () => {
    expect(linkPieces('javascript:alert(1) data:text/html,<b>x</b>')).toEqual([{ kind: 'text', text: 'javascript:alert(1) data:text/html,<b>x</b>' }]);
  });

  it('gives back the whole text when the pieces are joined', () => {
    const text = 'a https://x.test/(b) c\nhttps://y.test/z!';
    expect(linkPieces(text).map((p) => p.text).join('')).toBe(text);
  });
});

describe('CommentText', () => {
  it('shows HTML and scripts as the characters typed, with links only for web addresses', async () => {
    const fixture = TestBed.createComponent(CommentText);
    fixture.componentRef.setInput('text', '<script>alert(1)</script> <b>bold</b> <a href="javascript:x">y</a> https://ok.test');
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelector('script')).toBeNull();
    expect(element.querySelector('b')).toBeNull();
    const links = Array.from(element.querySelectorAll('a'));
    expect(links.map((a) => a.getAttribute('href'))).toEqual(['https://ok.test']);
    expect(element.textContent).toContain('<script>alert(1)</script> <b>bold</b>');
  });
});
