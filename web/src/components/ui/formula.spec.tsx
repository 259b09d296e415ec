import { waitFor } from '@testing-library/react';
import { POTENTIAL_FAMILIES } from '@sixtyfold/shared';
import { renderWithProviders } from '@/testing/render';
import { expressionToTex, Formula, symbolTex } from './formula';

describe('expressionToTex', () => {
  it('writes parameter names as Greek letters and subscripts', () => {
    expect(symbolTex('phi')).toBe('\\phi');
    expect(symbolTex('Lambda')).toBe('\\Lambda');
    expect(symbolTex('V0')).toBe('V_{0}');
    expect(symbolTex('lambda4')).toBe('\\lambda_{4}');
    expect(symbolTex('phi_end')).toBe('\\phi_{\\mathrm{end}}');
    expect(symbolTex('sigma_phi')).toBe('\\sigma_{\\phi}');
    expect(symbolTex('width')).toBe('\\mathit{width}');
  });

  it('typesets the Starobinsky potential with e^{…}, a square root and juxtaposed factors', () => {
    expect(expressionToTex('0.75 * mu^2 * (1 - exp(-sqrt(2/3) * phi))^2')).toBe(
      '0.75\\,{\\mu}^{2}\\,{\\left(1-e^{-\\sqrt{\\frac{2}{3}}\\,\\phi}\\right)}^{2}',
    );
  });

  it('keeps a multiplication sign before a number and shortens long constants', () => {
    expect(expressionToTex('phi * 2')).toBe('\\phi\\cdot2');
    expect(expressionToTex('1.224744871391589 * phi')).toBe('1.22474\\,\\phi');
    expect(expressionToTex('2e-10 * phi')).toBe('2\\times 10^{-10}\\,\\phi');
    expect(expressionToTex('1e-10 * phi')).toBe('10^{-10}\\,\\phi');
  });
});

describe('Formula', () => {
  it('renders every built-in family with KaTeX once it has loaded, with MathML for screen readers', async () => {
    for (const family of POTENTIAL_FAMILIES) {
      const { container, unmount } = renderWithProviders(<Formula expression={family.expression} lhs="V(\phi) =" />);
      await waitFor(() => expect(container.querySelector('math')).not.toBeNull());
      expect(container.querySelector('.katex-error')).toBeNull();
      unmount();
    }
  });

  it('shows the source text when the expression does not parse', async () => {
    renderWithProviders(<Formula expression="phi" />);
    await waitFor(() => expect(document.querySelector('.katex')).not.toBeNull()); // KaTeX is ready
    const { container } = renderWithProviders(<Formula expression="lambda * (phi" />);
    expect(container.querySelector('.katex')).toBeNull();
    expect(container).toHaveTextContent('lambda * (phi');
  });
});
