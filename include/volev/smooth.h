/* smooth.h: the smoothstep ramp the physics uses wherever a switch must be continuous
 * with its first derivative (for the stepper): 0 at or below lo, 1 at or above hi,
 * 3u^2 - 2u^3 between, u = (x - lo)/(hi - lo) (common practice). */
#ifndef VOLEV_SMOOTH_H
#define VOLEV_SMOOTH_H

static inline double vl_smoothstep(double x, double lo, double hi)
{
    if (hi <= lo)
        return x >= hi ? 1.0 : 0.0;
    double u = (x - lo) / (hi - lo);
    u = u < 0.0 ? 0.0 : u > 1.0 ? 1.0 : u;
    return u * u * (3.0 - 2.0 * u);
}

#endif
