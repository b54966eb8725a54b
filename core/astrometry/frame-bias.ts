import { type Mat3, multiply, rotationX, rotationY, rotationZ } from '../math/mat3.ts';
import { MAS } from '../units.ts';

/**
 * The frame bias matrix B taking ICRS (GCRS) axes to the mean equator and equinox of J2000.0
 * (the dynamical frame astronomy-engine calls EQJ): v_J2000 = B · v_ICRS.
 * B = R1(−η₀) · R2(ξ₀) · R3(dα₀) with dα₀ = −14.6 mas, ξ₀ = −16.617 mas, η₀ = −6.8192 mas
 * (IERS Conventions 2003, §5.5.2, eq. 28; IERS Conventions 2010 eq. 5.21). Accurate to the
 * neglected second-order terms, below 1 µas.
 */
export const FRAME_BIAS: Mat3 = multiply(
  rotationX(-(-6.8192 * MAS)),
  multiply(rotationY(-16.617 * MAS), rotationZ(-14.6 * MAS)),
);
