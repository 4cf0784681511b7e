import type { ShareSummary } from '@seinework/contracts';
import { sharedRunOf } from './shared-run';

const share = (audience: 'council' | 'public', runId: string | null): ShareSummary => ({ id: `s-${audience}`, audience, runId, sharedBy: 'Ana', sharedAt: '2026-12-01T10:00:00Z', closesAt: null });

describe('sharedRunOf', () => {
  it('is the run of the share of the audience asked for, else of any share, else none', () => {
    const option = { shares: [share('council', 'r-council'), share('public', 'r-public')] };
    expect(sharedRunOf(option, 'public')).toBe('r-public');
    expect(sharedRunOf(option, 'council')).toBe('r-council');
    expect(sharedRunOf(option)).toBe('r-council');
    expect(sharedRunOf({ shares: [share('public', null), share('council', 'r-1')] }, 'public')).toBe('r-1');
    expect(sharedRunOf({ shares: [] })).toBeNull();
    expect(sharedRunOf(null)).toBeNull();
  });
});
