import fc from 'fast-check';
import type { DesignInput } from '~/lib/schemas/design.ts';

/** Random valid designs in mm over the whole accepted range of strings, frets and temperaments. */
export const validDesignArbitrary: fc.Arbitrary<DesignInput> = fc
  .record({
    strings: fc.integer({ min: 2, max: 16 }),
    frets: fc.integer({ min: 1, max: 36 }),
    treble: fc.double({ min: 150, max: 1200, noNaN: true }),
    bassRatio: fc.double({ min: 0.85, max: 1.2, noNaN: true }),
    nut: fc.double({ min: 5, max: 120, noNaN: true }),
    taper: fc.double({ min: -4, max: 60, noNaN: true }),
    perpendicularShare: fc.double({ min: 0, max: 1, noNaN: true }),
    divisions: fc.integer({ min: 5, max: 53 }),
    stopped: fc.boolean(),
    zeroFret: fc.boolean(),
  })
  .map(
    (r): DesignInput => ({
      name: 'Random board',
      units: 'mm',
      strings: r.strings,
      scale: { treble: r.treble, bass: r.treble * r.bassRatio },
      perpendicularFret: r.perpendicularShare * r.frets,
      frets: r.frets,
      stringSpacing: { nut: r.nut, bridge: r.nut + r.taper },
      temperament: { kind: 'equal', divisions: r.divisions },
      slot: { stopped: r.stopped, stopDistance: 0.5 },
      zeroFret: r.zeroFret,
    }),
  );

/** A field path and a value that field must never accept. */
export const invalidFieldArbitrary: fc.Arbitrary<[string, unknown]> = fc.oneof(
  fc.tuple(
    fc.constantFrom('scale.treble', 'scale.bass', 'stringSpacing.nut', 'stringSpacing.bridge'),
    fc.oneof(
      fc.double({ max: 0, noNaN: true }),
      fc.double({ min: 5001, noNaN: true }),
      fc.constantFrom(Number.NaN, 'NaN', null, '650', [], {}),
    ),
  ),
  fc.tuple(
    fc.constantFrom('strings', 'frets'),
    fc.oneof(
      fc.integer({ min: 37 }),
      fc.integer({ max: 0 }),
      fc.double({ min: 2.01, max: 15.99, noNaN: true }).filter((v) => !Number.isInteger(v)),
      fc.string(),
    ),
  ),
  fc.tuple(fc.constant('perpendicularFret'), fc.oneof(fc.double({ max: -1e-9, noNaN: true }), fc.double({ min: 24.001, noNaN: true }))),
  fc.tuple(fc.constant('units'), fc.string().filter((s) => s !== 'mm' && s !== 'in')),
  fc.tuple(fc.constant('name'), fc.oneof(fc.constant(''), fc.string({ minLength: 121, maxLength: 300 }).filter((s) => s.trim().length > 120))),
);
