import { WebError } from '@seinework/network-analysis';
import { parseHarvestOption } from './parse-option';

describe('parseHarvestOption (OPTION.json, METHODS.md §11)', () => {
  it('defaults the response to bottom-up', () => {
    expect(parseHarvestOption({ name: 'x', adjustments: [] })).toEqual({ name: 'x', response: 'bottom-up', adjustments: [] });
  });

  it.each([
    [{ name: 'x', adjustments: [{ type: 'scale-catch', fleet: 'f', compartment: 'c', percent: -150 }] }, /option: adjustments\[0\]\.percent: percent must not be below -100/],
    [{ name: 'x', adjustments: [{ type: 'trawl-more' }] }, /option: adjustments\[0\]\.type: type must be one of/],
    [{ name: 'x', response: 'top-down', adjustments: [] }, /option: response: response must be "bottom-up" or "least-change"/],
    [{ name: 'x', adjustments: [], colour: 'teal' }, /colour/],
    [{ name: 'x', adjustments: [], uncertainty: { draws: 0, cv: 0.1, seed: 1 } }, /draws must be at least 1/],
  ])('refuses %j with a WebError naming the field', (input, message) => {
    expect(() => parseHarvestOption(input)).toThrow(WebError);
    expect(() => parseHarvestOption(input)).toThrow(message);
  });
});
