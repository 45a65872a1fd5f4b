export { computeAgreement } from "./report";
export { encodeRatings, type EncodedRatings, type RatingRow } from "./encode";
export { AgreementInputError, agreementOptionsSchema } from "./validate";
export { LANDIS_KOCH_BANDS, coefficient, describeCoefficient, describePercent, formatCoefficient, landisKochBand } from "./bands";
export { wilsonProportion } from "./proportion";
export { percentileInterval, quantileSorted, MIN_DEFINED_SHARE } from "./bootstrap";
export { createRandom } from "./prng";
export type * from "./types";
