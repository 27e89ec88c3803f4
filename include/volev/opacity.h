/* opacity.h: absorption by the atmosphere's gases in each spectral band (spectrum.h):
 * the lines of H2O and CO2 as a statistical band model turned into a k-distribution,
 * the continuum of water vapour, and collision-induced absorption (CIA) of CO2-CO2,
 * N2-N2, H2-H2 and H2-N2. Coefficients, their sources and what was calibrated:
 * docs/model.md section 3.2.
 *
 * Lines. Each band of each gas is described by its mean absorption coefficient k (the
 * band's integrated line intensity over its width) and the ratio b = gamma/delta of
 * the lines' width to their mean spacing. With the line strengths of Malkmus's
 * statistical model (Malkmus 1967, J. Opt. Soc. Am. 57:323) the band transmission over
 * an absorber path u is T = exp(-2b (sqrt(1 + k u / b) - 1)): exp(-k u) for weak lines,
 * exp(-2 sqrt(b k u)) for strong isolated ones. Its k-distribution is the inverse
 * Gaussian of mean k and shape 2 b k (the Laplace transform of which is that T), which
 * is split here into VL_NG intervals of cumulative probability g, each represented by
 * the mean k over it; the correlated-k method (Lacis & Oinas 1991, JGR 96:9027) then
 * treats every layer with the same g ordering. Pressure broadening enters through b:
 * the Lorentz width grows with pressure, so lines overlap more and the distribution
 * narrows; a Doppler width floor keeps b from vanishing at low pressure. */
#ifndef VOLEV_OPACITY_H
#define VOLEV_OPACITY_H

#include "volev/spectrum.h"

/* Intervals of the cumulative probability g and their widths (the weights). */
#define VL_NG 6
extern const double vl_g_weight[VL_NG];

/* Gases with lines. */
enum { VL_LINE_H2O, VL_LINE_CO2, VL_NLINEGAS };

/* Where the near-infrared H2O bands begin, cm^-1 (5 um). */
#define VL_NIR_CM 2000.0

/* Scale factors on the coefficients (1 = as tabulated; calibration: docs/model.md). */
typedef struct vl_opacity_scales {
    double h2o_lines;          /* H2O lines below VL_NIR_CM (rotation, 6.3 um) */
    double h2o_nir_lines;      /* H2O lines from VL_NIR_CM up (2.7 um and shorter) */
    double co2_lines;
    double h2o_continuum;
    double co2_continuum;      /* CO2-CO2 collision-induced and far-wing absorption */
    double cia;                /* the other pairs: N2-N2, H2-H2, H2-N2 */
} vl_opacity_scales;

/* Pairs with collision-induced absorption. */
enum { VL_CIA_CO2_CO2, VL_CIA_N2_N2, VL_CIA_H2_H2, VL_CIA_H2_N2, VL_NCIA };

/* One layer's gas content. */
typedef struct vl_layer_gas {
    double t_k;                /* layer temperature */
    double p_pa;               /* layer (mid) pressure */
    double dp_pa;              /* pressure thickness */
    double g;                  /* gravity, m/s^2 */
    double x[5];               /* mole fractions: H2O, CO2, N2, O2, H2 (enum vl_gas) */
    double m_mean_kg_mol;      /* mean molar mass of the layer's gas */
} vl_layer_gas;

/* What every band needs of one layer, computed once per layer. */
typedef struct vl_opacity_layer {
    double u[VL_NLINEGAS];     /* mass path of each gas with lines, kg/m^2 */
    double ln_t;               /* ln(T / 296 K) */
    double lorentz[VL_NLINEGAS]; /* (p_broad / 1 atm)(296 K / T)^0.7 */
    double doppler[VL_NLINEGAS]; /* Doppler half width over wavenumber: 3.581e-7 sqrt(T/M) */
    double cont_self;          /* N_w e exp(T0 (1/T - 1/296)): times C_self gives the depth */
    double cont_foreign;       /* N_w c_f p_foreign: the same for the foreign continuum */
    double cia[VL_NCIA];       /* x1 x2 n^2 dz (T/296)^-n: times k gives the depth */
} vl_opacity_layer;

/* The layer's values (lg) for every band. */
void vl_opacity_layer_prepare(const vl_layer_gas *lg, vl_opacity_layer *ol);

/* 1 if gas has lines in band b. */
int vl_opacity_has_lines(int gas, int b);

/* The mean absorption coefficient (m^2 per kg of the gas) of gas's lines in band b at the
 * layer's temperature, and the ratio b of line width to spacing there. */
double vl_opacity_kmean(const vl_opacity_scales *s, int gas, int b, const vl_opacity_layer *ol);
double vl_opacity_bratio(int gas, int b, const vl_opacity_layer *ol);

/* The VL_NG coefficients (multiples of the mean) of the inverse-Gaussian k-distribution
 * of shape phi = 2 b, one per g interval: their weighted mean is 1. */
void vl_opacity_gpoints(double phi, double q[VL_NG]);

/* The optical depth of the layer in band b from everything but lines: the H2O
 * continuum and CIA (vertical, not multiplied by any diffusivity factor). */
double vl_opacity_grey_tau(const vl_opacity_scales *s, int b, const vl_opacity_layer *ol);

/* The line optical depths of gas in the layer for each g interval (vertical). */
void vl_opacity_line_tau(const vl_opacity_scales *s, int gas, int b, const vl_opacity_layer *ol,
                         double tau[VL_NG]);

#endif
