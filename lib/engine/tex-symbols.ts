// Kept free of mathjs so that browser code can typeset symbols without loading the parser.
const GREEK: Record<string, string> = {
  alpha: '\\alpha', beta: '\\beta', gamma: '\\gamma', delta: '\\delta', eps: '\\varepsilon', epsilon: '\\varepsilon',
  zeta: '\\zeta', eta: '\\eta', theta: '\\theta', kappa: '\\kappa', lambda: '\\lambda', mu: '\\mu', nu: '\\nu',
  xi: '\\xi', pi: '\\pi', rho: '\\rho', sigma: '\\sigma', tau: '\\tau', phi: '\\phi', chi: '\\chi', psi: '\\psi',
  omega: '\\omega', Delta: '\\Delta', Gamma: '\\Gamma', Theta: '\\Theta',
};

/** TeX for a symbol: Re_D → \mathrm{Re}_{D}, delta_t → \delta_{t}, eps_D → \varepsilon_{D}. */
export function symbolTex(name: string): string {
  const [base, ...rest] = name.split('_');
  const b = GREEK[base] ?? (base.length > 1 ? `\\mathrm{${base}}` : base);
  const sub = rest.join(',');
  return sub ? `${b}_{\\mathrm{${sub}}}` : b;
}

