// The NIST StRD model formulas (as stated in each file) with their analytic partial derivatives.
import type { JacobianFunction, ModelFunction } from '../../core/fit';

/** Model and analytic Jacobian of one reference problem. */
export interface StrdModel {
  readonly model: ModelFunction;
  /** Absent for the extra problems, which are fitted with central differences only. */
  readonly jacobian?: JacobianFunction;
}

/** Model (and analytic Jacobian where given) per dataset name, as stated in the NIST files. */
export const STRD_MODELS: Record<string, StrdModel> = {
  // y = b1*(1-exp[-b2*x])  (Misra1a and BoxBOD)
  Misra1a: {
    model: ([b1, b2]) => (x) => b1 * (1 - Math.exp(-b2 * x)),
    jacobian: ([b1, b2]) => (x) => [1 - Math.exp(-b2 * x), b1 * x * Math.exp(-b2 * x)],
  },
  BoxBOD: {
    model: ([b1, b2]) => (x) => b1 * (1 - Math.exp(-b2 * x)),
    jacobian: ([b1, b2]) => (x) => [1 - Math.exp(-b2 * x), b1 * x * Math.exp(-b2 * x)],
  },
  // y = b1 / (1+exp[b2-b3*x])
  Rat42: {
    model: ([b1, b2, b3]) => (x) => b1 / (1 + Math.exp(b2 - b3 * x)),
    jacobian: ([b1, b2, b3]) => (x) => {
      const e = Math.exp(b2 - b3 * x), q = 1 + e;
      return [1 / q, (-b1 * e) / (q * q), (b1 * x * e) / (q * q)];
    },
  },
  // y = b1 / ((1+exp[b2-b3*x])**(1/b4))
  Rat43: {
    model: ([b1, b2, b3, b4]) => (x) => b1 / (1 + Math.exp(b2 - b3 * x)) ** (1 / b4),
    jacobian: ([b1, b2, b3, b4]) => (x) => {
      const e = Math.exp(b2 - b3 * x), q = 1 + e, f = q ** (-1 / b4);
      return [f, (-b1 * f * e) / (b4 * q), (b1 * f * x * e) / (b4 * q), (b1 * f * Math.log(q)) / (b4 * b4)];
    },
  },
  // y = b1*exp(-b2*x) + b3*exp(-b4*x) + b5*exp(-b6*x)
  Lanczos3: {
    model: ([b1, b2, b3, b4, b5, b6]) => (x) => b1 * Math.exp(-b2 * x) + b3 * Math.exp(-b4 * x) + b5 * Math.exp(-b6 * x),
    jacobian: ([b1, b2, b3, b4, b5, b6]) => (x) => {
      const e1 = Math.exp(-b2 * x), e2 = Math.exp(-b4 * x), e3 = Math.exp(-b6 * x);
      return [e1, -b1 * x * e1, e2, -b3 * x * e2, e3, -b5 * x * e3];
    },
  },
  // y = exp(-b1*x)/(b2+b3*x)
  Chwirut2: {
    model: ([b1, b2, b3]) => (x) => Math.exp(-b1 * x) / (b2 + b3 * x),
    jacobian: ([b1, b2, b3]) => (x) => {
      const e = Math.exp(-b1 * x), q = b2 + b3 * x;
      return [(-x * e) / q, -e / (q * q), (-x * e) / (q * q)];
    },
  },
  // y = (b1/b2) * exp[-0.5*((x-b3)/b2)**2]
  Eckerle4: {
    model: ([b1, b2, b3]) => (x) => (b1 / b2) * Math.exp(-0.5 * ((x - b3) / b2) ** 2),
    jacobian: ([b1, b2, b3]) => (x) => {
      const z = (x - b3) / b2, e = Math.exp(-0.5 * z * z), f = (b1 / b2) * e;
      return [e / b2, f * (z * z - 1) / b2, (f * z) / b2];
    },
  },
  // Extra certified problems beyond the required set (central differences only).
  // y = b1*x**b2
  DanWood: { model: ([b1, b2]) => (x) => b1 * x ** b2 },
  // y = b1*(x**2+x*b2) / (x**2+x*b3+b4)
  MGH09: { model: ([b1, b2, b3, b4]) => (x) => (b1 * (x * x + x * b2)) / (x * x + x * b3 + b4) },
  // y = (b1 + b2*x + b3*x**2 + b4*x**3) / (1 + b5*x + b6*x**2 + b7*x**3)
  Thurber: {
    model: ([b1, b2, b3, b4, b5, b6, b7]) => (x) =>
      (b1 + b2 * x + b3 * x * x + b4 * x ** 3) / (1 + b5 * x + b6 * x * x + b7 * x ** 3),
  },
  // y = b1*exp( -b2*x ) + b3*exp( -(x-b4)**2 / b5**2 ) + b6*exp( -(x-b7)**2 / b8**2 )
  Gauss1: {
    model: ([b1, b2, b3, b4, b5, b6, b7, b8]) => (x) =>
      b1 * Math.exp(-b2 * x) + b3 * Math.exp(-((x - b4) ** 2) / b5 ** 2) + b6 * Math.exp(-((x - b7) ** 2) / b8 ** 2),
  },
};
