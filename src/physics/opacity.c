/* opacity.c: band absorption coefficients (opacity.h).
 *
 * Every tabulated number below is from memory (order-of-magnitude knowledge of the
 * HITRAN line lists, the MT_CKD/Roberts water continuum and published collision-induced
 * spectra), not read from a data file: no spectroscopic database is available to this
 * project. They fix the spectral shape; four scale factors (opacity.h) are calibrated
 * against published outcomes, and docs/model.md section 3.4 says which results are
 * calibration targets and which are predictions. */
#include "volev/opacity.h"

#include <math.h>
#include <pthread.h>

#include <gsl/gsl_cdf.h>
#include <gsl/gsl_sf_erf.h>

#include "volev/reservoir.h"
#include "volev/units.h"

/* g intervals [0, .5, .8, .93, .98, .995, 1]: fine near g = 1, where the strong line
 * centres sit (common practice of k-distribution schemes). */
static const double g_edge[VL_NG + 1] = {0.0, 0.5, 0.8, 0.93, 0.98, 0.995, 1.0};
const double vl_g_weight[VL_NG] = {0.5, 0.3, 0.13, 0.05, 0.015, 0.005};

/* Per band: integrated line intensity at 296 K (cm/molecule, summed over the band's
 * lines), the exponent n of its temperature scaling (T/296 K)^n (positive where hot
 * bands fill the band at high temperature), and b0 = gamma/delta at 1 bar and 296 K.
 * From memory (HITRAN band totals: H2O rotation ~5e-17, 6.3 um ~1.0e-17, 2.7 um ~7e-18,
 * 1.87 um ~8e-19, 1.38 um ~2e-19, 1.13 um ~2e-20, 0.94 um ~1e-20; CO2 15 um ~8e-18,
 * 4.3 um ~9.5e-17, 2.7 um ~2.6e-18, 2.0 um ~5e-20, 1.6 um ~5e-21 cm/molecule). */
typedef struct {
    double s;   /* cm/molecule */
    double n;   /* temperature exponent */
    double b0;  /* width over spacing, 1 bar, 296 K */
} line_band;

static const line_band h2o_lines[VL_NBANDS] = {
    {1.6e-17, -0.5, 0.03},  {1.9e-17, -0.5, 0.03}, {1.1e-17, -0.5, 0.03}, {3.5e-18, 1.0, 0.02},
    {1.3e-18, 1.0, 0.02},   {6.0e-19, 1.0, 0.02},  {2.5e-19, 1.0, 0.02},  {1.2e-19, 1.0, 0.02},
    {1.5e-20, 3.0, 0.005},  {8.0e-21, 3.0, 0.005}, {3.0e-20, 3.0, 0.005}, {1.2e-18, 1.0, 0.04},
    {4.0e-18, 0.0, 0.04},   {5.0e-18, 0.0, 0.04},  {6.0e-19, 2.0, 0.01},  {4.0e-20, 2.0, 0.01},
    {1.0e-20, 4.0, 0.01},   {1.0e-20, 4.0, 0.01},  {1.0e-18, 1.0, 0.02},  {6.5e-18, 0.0, 0.05},
    {6.0e-20, 4.0, 0.005},  {8.5e-19, 0.5, 0.03},  {1.0e-19, 3.0, 0.01},  {2.0e-19, 0.5, 0.03},
    {5.0e-21, 4.0, 0.005},  {2.0e-20, 1.0, 0.02},  {2.0e-21, 4.0, 0.005}, {1.0e-20, 1.0, 0.02},
    {1.2e-20, 2.0, 0.01},   {1.5e-21, 2.0, 0.01},  {1.0e-22, 2.0, 0.01},  {2.0e-23, 2.0, 0.01},
    {0, 0, 0.01},           {0, 0, 0.01}};

static const line_band co2_lines[VL_NBANDS] = {
    {0, 0, 0.05},         {0, 0, 0.05},         {0, 0, 0.05},       {2.0e-20, 2.0, 0.02},
    {4.0e-19, 2.0, 0.02}, {6.5e-18, 0.0, 0.05}, {9.0e-19, 2.0, 0.02}, {1.0e-19, 2.0, 0.02},
    {2.0e-22, 6.0, 0.03}, {3.0e-22, 6.0, 0.03}, {5.0e-24, 8.0, 0.03}, {0, 0, 0.02},
    {0, 0, 0.02},         {5.0e-23, 6.0, 0.03}, {2.0e-21, 2.0, 0.02}, {3.0e-20, 2.0, 0.02},
    {9.5e-17, 0.0, 0.05}, {1.0e-21, 4.0, 0.02}, {0, 0, 0.02},       {2.6e-18, 0.5, 0.03},
    {0, 0, 0.02},         {5.0e-20, 1.0, 0.02}, {5.0e-21, 1.0, 0.02}, {1.0e-21, 1.0, 0.02},
    {0, 0, 0.02},         {0, 0, 0.02},         {0, 0, 0.02},       {0, 0, 0.02},
    {0, 0, 0.02},         {0, 0, 0.02},         {0, 0, 0.02},       {0, 0, 0.02},
    {0, 0, 0.02},         {0, 0, 0.02}};

/* Air-broadened half width at 1 atm and 296 K, cm^-1, and the self-broadening
 * efficiency (from memory: H2O 0.08 and ~5, CO2 0.07 and ~1.3). */
static const double gamma_air[VL_NLINEGAS] = {0.08, 0.07};
static const double self_efficiency[VL_NLINEGAS] = {5.0, 1.3};
static const int line_species[VL_NLINEGAS] = {VL_SP_H2O, VL_SP_CO2};

/* H2O self-continuum at 296 K at the band centre, cm^2 molecule^-1 atm^-1 (0 = use
 * Roberts et al. 1976, Appl. Opt. 15:2085: 1.25e-22 + 1.67e-19 exp(-7.87e-3 nu), fitted
 * to the 8-12 um window, used below 1850 cm^-1); beyond, order-of-magnitude MT_CKD
 * values in the windows and bands (from memory). */
static const double h2o_self_cont[VL_NBANDS] = {
    0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
    3e-23, 5e-24, 3e-24, 2e-24, 1e-23, 5e-23, 2e-24, 1e-23, 1e-24, 5e-24, 3e-25, 1e-24,
    1e-25, 5e-25, 0, 0, 0, 0, 0, 0};
#define CONT_T0_K 1800.0      /* exp(T0 (1/T - 1/296)) (Roberts et al. 1976) */
#define CONT_FOREIGN 0.005    /* foreign over self coefficient (from memory, MT_CKD window) */

/* Collision-induced absorption at 296 K, cm^-1 amagat^-2, and its temperature exponent
 * (T/296)^-n; from memory of the published spectra: CO2-CO2 far infrared and the
 * 1200-1500 cm^-1 dyad region (Gruszka & Borysow 1997, Icarus 129:172; Baranov et al.
 * 2004, J. Mol. Spectrosc. 228:432), N2-N2 roto-translational and fundamental (Borysow
 * & Frommhold 1986), H2-H2 (Borysow et al. 2001) and H2-N2 (Wordsworth & Pierrehumbert
 * 2013, Science 339:64). The CO2 row also carries, as the same density-squared
 * continuum, the sub-Lorentzian far wings of the strong bands that dense CO2 shows
 * between them (Perrin & Hartmann 1989, JQSRT 42:311) and the near-infrared window
 * continuum that Venus's night-side emission requires (Bezard et al. 2011, Icarus
 * 216:173), both from memory. */
static const double cia_k[VL_NCIA][VL_NBANDS] = {
    {1.2e-6, 8e-7, 2e-7, 3e-8, 5e-8, 1e-7, 5e-8, 2e-8, 5e-9, 1e-8, 1.5e-7, 2.5e-6, 1.5e-6,
     5e-9, 2e-9, 1e-8, 1e-7, 3e-8, 5e-9, 1e-8, 2e-8, 1e-8, 3e-9, 1e-9, 1e-9, 5e-10, 3e-10,
     0, 0, 0, 0, 0, 0, 0},
    {1e-7, 3e-8, 5e-9, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 3e-8, 1e-8, 0, 0, 0, 0, 0, 0,
     0, 0, 0, 0, 0, 0, 0, 0, 0, 0},
    {5e-7, 1.5e-6, 1e-6, 8e-7, 4e-7, 4e-7, 4e-7, 4e-7, 2e-7, 5e-8, 5e-8, 0, 0, 0, 0, 0, 0, 0,
     0, 0, 1.5e-7, 5e-8, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0},
    {6e-7, 1.8e-6, 1.2e-6, 1e-6, 5e-7, 5e-7, 5e-7, 5e-7, 2.4e-7, 6e-8, 6e-8, 0, 0, 0, 0, 0, 0,
     0, 0, 0, 1.8e-7, 6e-8, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0}};
static const double cia_n[VL_NCIA] = {1.5, 1.5, 0.5, 0.5};

#define LOSCHMIDT_M3 2.6867811e25 /* molecules per m^3 at 273.15 K, 1 atm (CODATA 2018) */
#define ATM_PA 101325.0

static const line_band *table_of(int gas) { return gas == VL_LINE_H2O ? h2o_lines : co2_lines; }

int vl_opacity_has_lines(int gas, int b) { return table_of(gas)[b].s > 0.0; }

/* Mass path of gas i (enum vl_gas index) in the layer, kg/m^2. */
static double mass_path(const vl_layer_gas *lg, int gas_index, int species)
{
    double q = lg->x[gas_index] * vl_species_molar_mass(species) / lg->m_mean_kg_mol;
    return q * lg->dp_pa / lg->g;
}

void vl_opacity_layer_prepare(const vl_layer_gas *lg, vl_opacity_layer *ol)
{
    double t = lg->t_k;
    ol->ln_t = log(t / 296.0);
    double lorentz_t = exp(-0.7 * ol->ln_t);
    for (int gas = 0; gas < VL_NLINEGAS; gas++) {
        int gi = gas == VL_LINE_H2O ? 0 : 1; /* enum vl_gas: H2O 0, CO2 1 */
        ol->u[gas] = mass_path(lg, gi, line_species[gas]);
        double p_broad = lg->p_pa * (1.0 + (self_efficiency[gas] - 1.0) * lg->x[gi]);
        ol->lorentz[gas] = p_broad / ATM_PA * lorentz_t;
        /* Doppler half width nu/c sqrt(2 ln2 k T / m) = 3.581e-7 nu sqrt(T / M[g/mol]) */
        ol->doppler[gas] = 3.581e-7 * sqrt(t / (vl_species_molar_mass(line_species[gas]) * 1e3));
    }
    /* water continuum: C (e exp(T0 (1/T - 1/296)) + c_f p_foreign) N_w, atm and cm^-2 */
    double n_w = mass_path(lg, 0, VL_SP_H2O) / (vl_species_molar_mass(VL_SP_H2O) / VL_AVOGADRO) * 1e-4;
    double e = lg->x[0] * lg->p_pa / ATM_PA, f = (1.0 - lg->x[0]) * lg->p_pa / ATM_PA;
    ol->cont_self = n_w * e * exp(CONT_T0_K * (1.0 / t - 1.0 / 296.0));
    ol->cont_foreign = n_w * CONT_FOREIGN * f;
    /* CIA: k (n1/n_L)(n2/n_L) dz, dz = dp / (rho g) in cm */
    double n = lg->p_pa / (VL_K_BOLTZMANN * t) / LOSCHMIDT_M3;
    double rho = lg->p_pa * lg->m_mean_kg_mol / (VL_R_GAS * t);
    double dz_cm = lg->dp_pa / (rho * lg->g) * 100.0;
    double x_bg = lg->x[2] + lg->x[3]; /* N2 and O2 together as the N2-like background */
    double pair[VL_NCIA] = {lg->x[1] * lg->x[1], x_bg * x_bg, lg->x[4] * lg->x[4], lg->x[4] * x_bg};
    for (int k = 0; k < VL_NCIA; k++)
        ol->cia[k] = pair[k] > 0.0 ? pair[k] * n * n * dz_cm * exp(-cia_n[k] * ol->ln_t) : 0.0;
}

double vl_opacity_kmean(const vl_opacity_scales *s, int gas, int b, const vl_opacity_layer *ol)
{
    const line_band *lb = &table_of(gas)[b];
    double width = vl_band_edge[b + 1] - vl_band_edge[b];
    double m_kg = vl_species_molar_mass(line_species[gas]) / VL_AVOGADRO;
    double scale = gas == VL_LINE_CO2                ? s->co2_lines
                   : vl_band_edge[b] >= VL_NIR_CM ? s->h2o_nir_lines
                                                  : s->h2o_lines;
    return scale * lb->s / width * 1e-4 / m_kg * exp(lb->n * ol->ln_t);
}

double vl_opacity_bratio(int gas, int b, const vl_opacity_layer *ol)
{
    const line_band *lb = &table_of(gas)[b];
    double delta = gamma_air[gas] / lb->b0; /* mean line spacing, cm^-1 */
    double g_l = gamma_air[gas] * ol->lorentz[gas];
    double g_d = ol->doppler[gas] * vl_band_centre(b);
    /* Voigt width (Olivero & Longbothum 1977, JQSRT 17:233) */
    double g_v = 0.5346 * g_l + sqrt(0.2166 * g_l * g_l + g_d * g_d);
    return g_v / delta;
}

/* ------------------------------------------------------------------ k-distribution */

/* CDF of the inverse Gaussian of mean 1 and shape l at x > 0 (Chhikara & Folks 1989,
 * The Inverse Gaussian Distribution): Phi(z1) + e^{2l} Phi(-z2), and its partial first
 * moment, the integral of t f(t) from 0 to x: Phi(z1) - e^{2l} Phi(-z2), with
 * z1 = sqrt(l/x)(x - 1), z2 = sqrt(l/x)(x + 1); the second term in logarithms. */
static void ig_cdf_moment(double x, double l, double *cdf, double *moment)
{
    double r = sqrt(l / x);
    double a = gsl_cdf_ugaussian_P(r * (x - 1.0));
    double b = exp(2.0 * l + gsl_sf_log_erfc(r * (x + 1.0) / 1.4142135623730951) - 0.6931471805599453);
    *cdf = a + b;
    *moment = a - b;
}

/* Quantile of the inverse Gaussian (mean 1, shape l) at g, by bisection in log x, and
 * the partial moment there. */
static double ig_quantile_moment(double g, double l)
{
    double lo = -80.0, hi = 40.0, c = 0.0, m = 0.0;
    for (int i = 0; i < 64; i++) {
        double mid = 0.5 * (lo + hi);
        ig_cdf_moment(exp(mid), l, &c, &m);
        if (c < g)
            lo = mid;
        else
            hi = mid;
    }
    ig_cdf_moment(exp(0.5 * (lo + hi)), l, &c, &m);
    return m;
}

/* Table of the interval means q_j(phi) on a log grid of phi. */
#define PHI_LO (-7.0)
#define PHI_HI 5.0
#define PHI_PER_DECADE 32
#define NPHI (12 * PHI_PER_DECADE + 1)
static double q_table[NPHI][VL_NG];
static pthread_once_t q_once = PTHREAD_ONCE_INIT;

/* The mean of k over each g interval: the difference of the partial moments at its ends
 * over its width (the moment is 0 at g = 0 and the mean, 1, at g = 1). */
static void fill_row(double phi, double q[VL_NG])
{
    double prev = 0.0;
    for (int j = 0; j < VL_NG; j++) {
        double m = j == VL_NG - 1 ? 1.0 : ig_quantile_moment(g_edge[j + 1], phi);
        q[j] = fmax(m - prev, 0.0) / vl_g_weight[j];
        prev = m;
    }
}

static void fill_table(void)
{
    for (int i = 0; i < NPHI; i++)
        fill_row(pow(10.0, PHI_LO + (double)i / PHI_PER_DECADE), q_table[i]);
}

void vl_opacity_gpoints(double phi, double q[VL_NG])
{
    pthread_once(&q_once, fill_table);
    double x = (log10(phi) - PHI_LO) * PHI_PER_DECADE;
    if (!(x > 0.0))
        x = 0.0;
    if (x > NPHI - 1)
        x = NPHI - 1;
    int i = (int)x < NPHI - 1 ? (int)x : NPHI - 2;
    double f = x - i;
    for (int j = 0; j < VL_NG; j++)
        q[j] = (1.0 - f) * q_table[i][j] + f * q_table[i + 1][j];
}

/* ------------------------------------------------------------------ layer depths */

void vl_opacity_line_tau(const vl_opacity_scales *s, int gas, int b, const vl_opacity_layer *ol,
                         double tau[VL_NG])
{
    double u = ol->u[gas];
    if (!(u > 0.0) || !vl_opacity_has_lines(gas, b)) {
        for (int j = 0; j < VL_NG; j++)
            tau[j] = 0.0;
        return;
    }
    double q[VL_NG];
    vl_opacity_gpoints(2.0 * vl_opacity_bratio(gas, b, ol), q);
    double ku = vl_opacity_kmean(s, gas, b, ol) * u;
    for (int j = 0; j < VL_NG; j++)
        tau[j] = ku * q[j];
}

/* H2O self-continuum coefficient of band b at 296 K, cm^2 molecule^-1 atm^-1. */
static double self_continuum(int b)
{
    if (h2o_self_cont[b] > 0.0 || vl_band_edge[b] >= 1850.0)
        return h2o_self_cont[b];
    return 1.25e-22 + 1.67e-19 * exp(-7.87e-3 * vl_band_centre(b));
}

double vl_opacity_grey_tau(const vl_opacity_scales *s, int b, const vl_opacity_layer *ol)
{
    double c = self_continuum(b) * s->h2o_continuum;
    double tau = c * (ol->cont_self + ol->cont_foreign);
    for (int k = 0; k < VL_NCIA; k++)
        if (cia_k[k][b] > 0.0)
            tau += (k == VL_CIA_CO2_CO2 ? s->co2_continuum : s->cia) * cia_k[k][b] * ol->cia[k];
    return tau;
}
