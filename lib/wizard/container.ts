import type { ContainerInput } from './types';

// Soil surface of a bonsai container from its inside dimensions, in cm².
// round: a circle, π·r² with r = diameter / 2
// rectangle: length × width
// oval: an ellipse, π·a·b with semi-axes a = length / 2, b = width / 2

export const surfaceFormulas = {
  round: 'circle: π × r², r = diameter ÷ 2',
  rectangle: 'rectangle: length × width',
  oval: 'ellipse: π × a × b, a = length ÷ 2, b = width ÷ 2',
} as const;

export function circleArea(diameterCm: number): number {
  const r = diameterCm / 2;
  return Math.PI * r * r;
}

export function rectangleArea(lengthCm: number, widthCm: number): number {
  return lengthCm * widthCm;
}

export function ellipseArea(lengthCm: number, widthCm: number): number {
  return Math.PI * (lengthCm / 2) * (widthCm / 2);
}

/** Soil surface in cm². A rectangle or oval without a width is treated as square / circular. */
export function surfaceAreaCm2(c: ContainerInput): number {
  const w = c.widthCm ?? c.lengthCm;
  switch (c.shape) {
    case 'round':
      return circleArea(c.lengthCm);
    case 'rectangle':
      return rectangleArea(c.lengthCm, w);
    case 'oval':
      return ellipseArea(c.lengthCm, w);
  }
}

export function describeContainer(c: ContainerInput): string {
  if (c.shape === 'round') return `round pot, ${c.lengthCm} cm across`;
  return `${c.shape} pot, ${c.lengthCm} × ${c.widthCm ?? c.lengthCm} cm`;
}
