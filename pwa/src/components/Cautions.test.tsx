import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { Cautions } from './Cautions';

afterEach(cleanup);

describe('Cautions', () => {
  it("links the product's safety data sheet and defers to it", () => {
    render(
      <Cautions
        kind="solvent"
        sdsUrl="https://sds.invalid/sap.pdf"
        productName="Sap and resin remover"
      />,
    );
    const link = screen.getByRole('link', { name: /Safety data sheet for Sap and resin remover/ });
    expect(link.getAttribute('href')).toBe('https://sds.invalid/sap.pdf');
    expect(link.getAttribute('rel')).toContain('noopener');
    expect(screen.getByText(/gloves and eye protection/i)).toBeTruthy();
    expect(screen.getByText(/safety data sheet, local codes and licensed practice/)).toBeTruthy();
  });

  it('names isocyanates for touch-up paint, and says when no data sheet is linked', () => {
    render(<Cautions kind="touch-up" productName="Touch-up paint, dark green" />);
    expect(screen.getByText(/isocyanates/)).toBeTruthy();
    expect(screen.queryByRole('link')).toBeNull();
    expect(screen.getByText(/No safety data sheet is linked/)).toBeTruthy();
  });

  it('outdoor power goes through an RCD (GFCI); a rotary is kept off edges', () => {
    render(
      <>
        <Cautions kind="power" />
        <Cautions kind="machine" />
      </>,
    );
    expect(screen.getByText(/RCD \(GFCI\)/)).toBeTruthy();
    expect(screen.getByText(/off edges/)).toBeTruthy();
    expect(screen.getByRole('complementary', { name: 'Outdoor power' })).toBeTruthy();
  });
});
