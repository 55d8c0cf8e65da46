// The words on an attention line's button follow where the line leads.
import { describe, expect, it } from 'vitest';
import { attentionAction } from '../../../src/features/advisers/attention-action.ts';

describe('attention line actions', () => {
  it('opens the zones when the line leads to the zone editor, the check otherwise', () => {
    expect(attentionAction({ reason: 'patch-above-threshold', link: '/fields/f/zones?checkId=c' })).toBe('Open the zones');
    expect(attentionAction({ reason: 'patch-above-threshold', link: '/fields/f/review?pest=p&check=c' })).toBe('Open the check');
    expect(attentionAction({ reason: 'field-above-threshold', link: '/fields/f/review?pest=p&check=c' })).toBe('Open the check');
  });

  it('asks for a check on unchecked sightings and opens the field when a walk is due', () => {
    expect(attentionAction({ reason: 'not-yet-checked', link: '/fields/f/review?pest=p' })).toBe('Run a check');
    expect(attentionAction({ reason: 'rescout-due', link: '/fields/f/review?pest=p' })).toBe('Open the field');
    expect(attentionAction({ reason: 'too-few-stops', link: '/fields/f/review?pest=p&check=c' })).toBe('Open the field');
  });
});
