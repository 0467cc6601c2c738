import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { stepKeys } from '@provenote/shared/schemas';
import { describe, expect, it } from 'vitest';
import { render } from '../../../test-utils/render';
import { cardHelp } from '../model/card-help';
import { CardHelp } from './CardHelp';

describe('CardHelp', () => {
  it('opens on the Assign card with the method, its sources and the caution', async () => {
    render(<CardHelp stepKey="assign" />);
    const toggle = screen.getByRole('button', { name: 'How this step works' });
    expect(toggle).toHaveAttribute('aria-expanded', 'false');
    await userEvent.click(toggle);
    // Mantine's collapse animates height, which jsdom does not lay out; the expanded state is what is asserted.
    expect(toggle).toHaveAttribute('aria-expanded', 'true');
    expect(screen.getByText(/Mahalanobis distance D² to every group/)).toBeInTheDocument();
    expect(screen.getByText(/Mahalanobis, P. C. \(1936\)/)).toBeInTheDocument();
    expect(screen.getByText(/§6\.5\.4\.3/)).toBeInTheDocument();
    expect(screen.getByText(/statistical evidence, not proof of origin/)).toBeInTheDocument();
  });

  it('has help for every card, and cites a source wherever a statistical method is applied', () => {
    expect(Object.keys(cardHelp).sort()).toEqual([...stepKeys].sort());
    for (const key of ['prepare', 'check', 'assign'] as const)
      expect(cardHelp[key].references.length).toBeGreaterThan(0);
  });
});
