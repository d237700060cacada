// Payload types generated from openapi.yaml (npm run gen:types), never copied by hand.
import type { components } from '../../shared/api/openapi-types';

type Schemas = components['schemas'];
export type AlloySummary = Schemas['AlloySummary'];
export type AlloyPage = Schemas['AlloyPage'];
export type Alloy = Schemas['Alloy'];
export type PropertyValue = Schemas['PropertyValue'];
export type MatchResult = Schemas['MatchResult'];
export type MatchCandidate = Schemas['MatchCandidate'];
export type Reading = Schemas['Reading'];
export type Problem = Schemas['Problem'];
export type Family = Schemas['Family'];
export type Checks = Schemas['Checks'];
export type EngineCheck = Schemas['EngineCheck'];
