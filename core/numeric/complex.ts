/** A complex number. Small and plain so that hot loops can inline the arithmetic. */
export type Complex = { re: number; im: number };

export function complex(re: number, im = 0): Complex {
  return { re, im };
}

export function complexAdd(a: Complex, b: Complex): Complex {
  return { re: a.re + b.re, im: a.im + b.im };
}

export function complexSub(a: Complex, b: Complex): Complex {
  return { re: a.re - b.re, im: a.im - b.im };
}

export function complexMul(a: Complex, b: Complex): Complex {
  return { re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re };
}

export function complexScale(a: Complex, s: number): Complex {
  return { re: a.re * s, im: a.im * s };
}

/** a / b, scaled (Smith's method) so that large or small parts do not overflow. */
export function complexDiv(a: Complex, b: Complex): Complex {
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re;
    const d = b.re + b.im * r;
    return { re: (a.re + a.im * r) / d, im: (a.im - a.re * r) / d };
  }
  const r = b.re / b.im;
  const d = b.re * r + b.im;
  return { re: (a.re * r + a.im) / d, im: (a.im * r - a.re) / d };
}

export function complexAbs(a: Complex): number {
  return Math.hypot(a.re, a.im);
}

export function complexConj(a: Complex): Complex {
  return { re: a.re, im: -a.im };
}
