// The contact-angle-from-force calculator's working and assumptions, written from the notes its
// solve records (contact-angle-from-force.ts): carried by its texts, so the widget's first flight
// has none of this text.
import type { ContactAngleFromForceAssumed, ContactAngleFromForceNotes } from './contact-angle-from-force.js';
import { fmt, q } from './shared.js';
import { gravityAssumption } from './shared-working.js';
import type { Explain, StepWriters } from './types.js';

const WILHELMY = 'Wilhelmy 1863, with the buoyancy of the immersed plate';

const steps: StepWriters<ContactAngleFromForceNotes> = {
  plate: ({ w, t, rho, g, h, F, sigma, both, adv }) => [
    {
      id: 'perimeter',
      label: 'Wetted length of the plate',
      formula: 'P = 2·(w + t)',
      substituted: `2 × (${q(w, 'm')} + ${q(t, 'm')})`,
      value: adv.perimeter,
      unit: 'm',
      source: 'geometry of the plate',
    },
    {
      id: 'buoyancy',
      label: 'Buoyancy of the immersed part of the plate',
      formula: 'B = ρ·g·w·t·h',
      substituted: `${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(w, 'm')} × ${q(t, 'm')} × ${q(h, 'm')}`,
      value: adv.buoyancy,
      unit: 'N',
      source: 'Archimedes: the displaced liquid of the immersed depth',
    },
    {
      id: 'cos',
      label: both ? 'Cosine of the advancing angle (immersion force)' : 'Cosine of the contact angle',
      formula: 'cos θ = (F + B) / (σ·P)',
      substituted: `(${q(F, 'N')} + ${q(adv.buoyancy, 'N')}) / (${q(sigma, 'N/m')} × ${q(adv.perimeter, 'm')})`,
      value: adv.cosTheta,
      unit: '1',
      source: WILHELMY,
    },
  ],
  angle: ({ both, cos, angle }) => [
    {
      id: 'angle',
      label: both ? 'Advancing contact angle' : 'Contact angle',
      formula: 'θ = arccos(cos θ)',
      substituted: `arccos(${fmt(cos, 6)})`,
      value: angle,
      unit: 'deg',
      source: WILHELMY,
    },
  ],
  recedingCos: ({ Fr, buoyancy, sigma, perimeter, rc }) => [
    {
      id: 'receding-cos',
      label: 'Cosine of the receding angle (withdrawal force)',
      formula: 'cos θ_r = (F_r + B) / (σ·P)',
      substituted: `(${q(Fr, 'N')} + ${q(buoyancy, 'N')}) / (${q(sigma, 'N/m')} × ${q(perimeter, 'm')})`,
      value: rc,
      unit: '1',
      source: WILHELMY,
    },
  ],
  recedingAngle: ({ rc, rec }) => [
    {
      id: 'receding-angle',
      label: 'Receding contact angle',
      formula: 'θ_r = arccos(cos θ_r)',
      substituted: `arccos(${fmt(rc, 6)})`,
      value: rec,
      unit: 'deg',
      source: WILHELMY,
    },
  ],
  hysteresis: ({ angle, receding, h }) => [
    {
      id: 'hysteresis',
      label: 'Contact-angle hysteresis',
      formula: 'Δθ = θ_a − θ_r',
      substituted: `${q(angle, 'deg')} − ${q(receding, 'deg')}`,
      value: h,
      unit: 'deg',
      source: 'definition',
    },
  ],
};

function assumptions({ both, g }: ContactAngleFromForceAssumed): string[] {
  return [
    'The force is net of the weight of the plate in air (the balance tared with the plate hanging above the liquid).',
    'The immersion depth is that of the lower edge below the undisturbed liquid surface when the force was read.',
    'A thin rectangular plate of the test material, uniform on all four sides, wetted along its whole perimeter 2·(w + t).',
    both
      ? 'The immersion force gives the advancing angle and the withdrawal force the receding angle, both read while the plate moves slowly at a steady speed.'
      : 'A single reading taken as the contact angle of the plate at rest (for a moving plate, the advancing or receding angle).',
    'The surface tension and density are those of the liquid as used: a clean liquid, air density neglected.',
    gravityAssumption(g),
  ];
}

export const explain: Explain = { steps, assumptions };
