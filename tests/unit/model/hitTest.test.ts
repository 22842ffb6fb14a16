// Picking on the plan: a press takes the item drawn on top (later in the list), never the one beneath.
import { describe, expect, it } from 'vitest';
import { createItem, hitTest } from '../../../model/kinds';

describe('hitTest', () => {
  const under = createItem('light', 'under', { x: 2, y: 2 });
  const over = createItem('light', 'over', { x: 2.05, y: 2 });
  const wall = createItem('wall', 'wall', { x: 2, y: 2 });

  it('takes the top item where two overlap (the later one is drawn on top)', () => {
    expect(hitTest([under, over], { x: 2.02, y: 2 }, 0.05)?.id).toBe('over');
    expect(hitTest([over, under], { x: 2.02, y: 2 }, 0.05)?.id).toBe('under');
  });

  it('takes a light standing on a wall rather than the wall beneath it', () => {
    expect(hitTest([wall, under], { x: 2, y: 2 }, 0.05)?.id).toBe('under');
  });

  it('finds nothing away from every item', () => {
    expect(hitTest([under, over, wall], { x: 6, y: 5 }, 0.05)).toBeNull();
  });
});
