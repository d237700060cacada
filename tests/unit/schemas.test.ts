import { describe, expect, it } from 'vitest';
import { loadApiDocument } from '../../backend/api-document';
import {
  densityUnitSchema,
  electricalUnitSchema,
  matchRequestSchema,
  temperatureUnitSchema,
} from '../../shared/schemas/match-request';

type Schema = {
  enum?: string[];
  properties?: Record<string, Schema & { minimum?: number; maximum?: number }>;
};
const schemas = (loadApiDocument().components as { schemas: Record<string, Schema> }).schemas;

describe('the shared zod schema and openapi.yaml agree', () => {
  it('on the unit codes', () => {
    expect([...electricalUnitSchema.options].sort()).toEqual(
      [...schemas.ElectricalUnit!.enum!].sort(),
    );
    expect([...densityUnitSchema.options].sort()).toEqual([...schemas.DensityUnit!.enum!].sort());
    expect([...temperatureUnitSchema.options].sort()).toEqual(
      [...schemas.TemperatureUnit!.enum!].sort(),
    );
  });

  it('on the limits of a Match request', () => {
    const props = schemas.MatchRequest!.properties!;
    expect(props.uncertaintyPercent).toMatchObject({ minimum: 0.1, maximum: 50 });
    expect(props.limit).toMatchObject({ minimum: 1, maximum: 50 });
    const ok = { conductivity: { value: 28, unit: '%IACS' } };
    expect(matchRequestSchema.safeParse(ok).success).toBe(true);
    expect(matchRequestSchema.safeParse({ ...ok, uncertaintyPercent: 50.1 }).success).toBe(false);
    expect(matchRequestSchema.safeParse({ ...ok, uncertaintyPercent: 0.05 }).success).toBe(false);
    expect(
      matchRequestSchema.safeParse({ conductivity: { value: 0, unit: '%IACS' } }).success,
    ).toBe(false);
    expect(
      matchRequestSchema.safeParse({ conductivity: { value: 28, unit: 'furlong' } }).success,
    ).toBe(false);
    expect(
      matchRequestSchema.safeParse({ ...ok, temperature: { value: -500, unit: 'F' } }).success,
    ).toBe(false);
    expect(matchRequestSchema.safeParse({ ...ok, extra: 1 }).success).toBe(false);
  });
});
