/* radiation.c: band radiative transfer through a column (radiation.h).
 *
 * Thermal: two-stream without scattering, diffusivity D = 1.66, Planck source linear in
 * optical depth within each layer: the upward flux across a layer of optical depth
 * Delta (already times D) is
 *   F_top = F_bot e^-Delta + B_top (1 - e^-Delta) + (B_bot - B_top)(1 - (1 + Delta) e^-Delta)/Delta,
 * starting from the surface's sigma T_s^4 share in the band (emissivity 1). The lines of
 * H2O and CO2 overlap at random: every pair of g intervals, weight w_i w_j (correlated
 * in the vertical); where one gas's lines are thin (column depth below 0.05) they are
 * folded into the grey depth. Starlight: the same pairs, each layer a homogeneous
 * two-stream layer (absorption plus Rayleigh scattering, asymmetry 0) with the
 * diffusivity-scaled hemispheric coefficients gamma1 = D (1 - omega/2),
 * gamma2 = D omega/2 (Toon et al. 1989, JGR 94:16287, with D for 2), reflectance and
 * transmission R = gamma2 sinh(kt)/(k cosh(kt) + gamma1 sinh(kt)),
 * T = k/(k cosh(kt) + gamma1 sinh(kt)), k = sqrt(gamma1^2 - gamma2^2), combined by the
 * adding method from the top. The stellar beam is treated as diffuse (the
 * planet-averaged illumination of one-dimensional global-mean models; common practice).
 * A cloud layer adds its depths to the two layers around its level, shared linearly in
 * the level coordinate, so that every result is continuous in the surface pressure. */
#include "volev/radiation.h"

#include <math.h>
#include <pthread.h>
#include <string.h>

#include "volev/reservoir.h"
#include "volev/units.h"

#define NLAYERS (VL_PROFILE_LEVELS - 1)
#define MINOR_TAU 0.05
#define CLOUD_G 0.85

static const int gas_species[VL_NGASES] = {VL_SP_H2O, VL_SP_CO2, VL_SP_N2, VL_SP_O2, VL_SP_H2};

/* Optical depths of one band: grey part and the g intervals of each gas with lines. */
typedef struct {
    double grey[NLAYERS];
    double line[VL_NLINEGAS][NLAYERS][VL_NG];
    int has[VL_NLINEGAS];
} band_tau;

static void layer_gas(const vl_profile *pr, int l, double g, vl_layer_gas *lg)
{
    lg->p_pa = sqrt(pr->p[l] * pr->p[l + 1]);
    lg->dp_pa = pr->p[l] - pr->p[l + 1];
    lg->t_k = 0.5 * (pr->t[l] + pr->t[l + 1]);
    lg->g = g;
    for (int i = 0; i < VL_NGASES; i++)
        lg->x[i] = 0.5 * (pr->x[l][i] + pr->x[l + 1][i]);
    lg->m_mean_kg_mol = 0.5 * (pr->m_mean[l] + pr->m_mean[l + 1]);
}

/* Every layer's opacity values, once per column. */
static void prepare_layers(const vl_profile *pr, double g, vl_opacity_layer *ol)
{
    for (int l = 0; l < pr->n - 1; l++) {
        vl_layer_gas lg;
        layer_gas(pr, l, g, &lg);
        vl_opacity_layer_prepare(&lg, &ol[l]);
    }
}

/* Fold the lines of a minor gas into the grey depths. */
static void fold_minor(const vl_opacity_scales *s, int nl, const vl_opacity_layer *ol, int b,
                       band_tau *bt)
{
    double col[VL_NLINEGAS] = {0.0, 0.0};
    for (int gas = 0; gas < VL_NLINEGAS; gas++)
        for (int l = 0; l < nl; l++)
            col[gas] += vl_opacity_kmean(s, gas, b, &ol[l]) * ol[l].u[gas];
    int minor = col[VL_LINE_H2O] < col[VL_LINE_CO2] ? VL_LINE_H2O : VL_LINE_CO2;
    if (col[minor] >= MINOR_TAU)
        return;
    for (int l = 0; l < nl; l++)
        bt->grey[l] += vl_opacity_kmean(s, minor, b, &ol[l]) * ol[l].u[minor];
    bt->has[minor] = 0;
}

static void band_depths(const vl_opacity_scales *s, int nl, const vl_opacity_layer *ol, int b,
                        band_tau *bt)
{
    for (int gas = 0; gas < VL_NLINEGAS; gas++)
        bt->has[gas] = vl_opacity_has_lines(gas, b);
    for (int l = 0; l < nl; l++)
        bt->grey[l] = vl_opacity_grey_tau(s, b, &ol[l]);
    if (bt->has[0] && bt->has[1])
        fold_minor(s, nl, ol, b, bt);
    for (int l = 0; l < nl; l++)
        for (int gas = 0; gas < VL_NLINEGAS; gas++)
            if (bt->has[gas])
                vl_opacity_line_tau(s, gas, b, &ol[l], bt->line[gas][l]);
}

/* The g intervals of gas in this band: VL_NG, or a single one of weight 1 without lines. */
static int nint(const band_tau *bt, int gas) { return bt->has[gas] ? VL_NG : 1; }
static double weight(const band_tau *bt, int gas, int i) { return bt->has[gas] ? vl_g_weight[i] : 1.0; }
static double line(const band_tau *bt, int gas, int l, int i)
{
    return bt->has[gas] ? bt->line[gas][l][i] : 0.0;
}

/* The cloud's extra depth in each layer (0 without a cloud): the depth tau shared
 * between the layers below and above the cloud's fractional level. */
static void cloud_depths(const vl_profile *pr, const vl_cloud *cl, double tau, double *extra)
{
    int nl = pr->n - 1;
    memset(extra, 0, (size_t)nl * sizeof extra[0]);
    if (!cl || !(tau > 0.0))
        return;
    /* the cloud's fractional level, linear in ln p between levels */
    double lp = log(cl->p_ratio * pr->p[0]), x = 0.5;
    for (int k = 0; k < nl; k++)
        if (log(pr->p[k + 1]) <= lp) {
            x = k + (log(pr->p[k]) - lp) / (log(pr->p[k]) - log(pr->p[k + 1]));
            break;
        }
    x = x < 0.5 ? 0.5 : x > nl - 1.5 ? nl - 1.5 : x;
    int k = (int)(x - 0.5);
    double f = x - 0.5 - k;
    extra[k] += (1.0 - f) * tau;
    extra[k + 1] += f * tau;
}

/* Upward thermal flux at the top of the column for one (i, j) pair. */
static double up_flux(const band_tau *bt, int nl, const double *bl, const double *extra, int i,
                      int j)
{
    double f = bl[0];
    for (int l = 0; l < nl; l++) {
        double d = VL_DIFFUSIVITY *
                   (bt->grey[l] + extra[l] + line(bt, 0, l, i) + line(bt, 1, l, j));
        double e, a, lin;
        if (d > 1e-3) {
            e = exp(-d);
            a = 1.0 - e;
            lin = (a - d * e) / d;
        } else { /* series: 1 - e^-d and (1 - (1 + d) e^-d)/d to third order */
            a = d * (1.0 - d * (0.5 - d / 6.0));
            e = 1.0 - a;
            lin = d * (0.5 - d / 3.0);
        }
        f = f * e + bl[l + 1] * a + (bl[l] - bl[l + 1]) * lin;
    }
    return f;
}

/* Planck fluxes of band b at every level. */
static void planck_levels(const vl_profile *pr, int b, double *bl)
{
    for (int k = 0; k < pr->n; k++)
        bl[k] = vl_planck_band(b, pr->t[k]);
}

static double band_olr(const band_tau *bt, const vl_profile *pr, const double *bl,
                       const double *extra)
{
    double t2 = pr->t[0] * pr->t[0];
    if (bl[0] < 1e-12 * VL_SIGMA_SB * t2 * t2)
        return bl[0];
    double olr = 0.0;
    for (int i = 0; i < nint(bt, 0); i++)
        for (int j = 0; j < nint(bt, 1); j++)
            olr += weight(bt, 0, i) * weight(bt, 1, j) * up_flux(bt, pr->n - 1, bl, extra, i, j);
    return olr;
}

double vl_radiation_band_olr(const vl_opacity_scales *s, const vl_profile *pr, double g, int b)
{
    band_tau t;
    vl_opacity_layer ol[NLAYERS];
    double none[NLAYERS], bl[VL_PROFILE_LEVELS];
    prepare_layers(pr, g, ol);
    band_depths(s, pr->n - 1, ol, b, &t);
    cloud_depths(pr, NULL, 0.0, none);
    planck_levels(pr, b, bl);
    return band_olr(&t, pr, bl, none);
}

double vl_radiation_olr(const vl_opacity_scales *s, const vl_profile *pr, double g)
{
    vl_opacity_layer ol[NLAYERS];
    double none[NLAYERS];
    prepare_layers(pr, g, ol);
    cloud_depths(pr, NULL, 0.0, none);
    double olr = 0.0, bl[VL_PROFILE_LEVELS];
    for (int b = 0; b < VL_NBANDS; b++) {
        band_tau t;
        band_depths(s, pr->n - 1, ol, b, &t);
        planck_levels(pr, b, bl);
        olr += band_olr(&t, pr, bl, none);
    }
    return olr;
}

/* Reflectance and transmission of a homogeneous diffuse two-stream layer. */
static void layer_rt(double tau, double omega, double *r, double *t)
{
    double g1 = VL_DIFFUSIVITY * (1.0 - 0.5 * omega), g2 = VL_DIFFUSIVITY * 0.5 * omega;
    double k = sqrt(fmax(g1 * g1 - g2 * g2, 0.0)), kt = k * tau;
    if (kt < 1e-8) { /* conservative or thin: sinh(kt)/k -> tau, cosh -> 1 */
        double den = 1.0 + g1 * tau;
        *r = g2 * tau / den;
        *t = 1.0 / den;
        return;
    }
    double e1 = exp(-kt), e2 = e1 * e1, den = k * (1.0 + e2) + g1 * (1.0 - e2);
    *r = g2 * (1.0 - e2) / den;
    *t = 2.0 * k * e1 / den;
}

/* vl_rayleigh_air of every band, computed once. */
static double rayleigh_air[VL_NBANDS];
static pthread_once_t rayleigh_once = PTHREAD_ONCE_INIT;
static void fill_rayleigh(void)
{
    for (int b = 0; b < VL_NBANDS; b++)
        rayleigh_air[b] = vl_rayleigh_air(b);
}

/* Rayleigh optical depth of every layer in band b. */
static void rayleigh_depths(const vl_profile *pr, double g, int b, double *ray)
{
    pthread_once(&rayleigh_once, fill_rayleigh);
    for (int l = 0; l < pr->n - 1; l++) {
        vl_layer_gas lg;
        layer_gas(pr, l, g, &lg);
        double ratio = 0.0;
        for (int i = 0; i < VL_NGASES; i++)
            ratio += lg.x[i] * vl_rayleigh_ratio(gas_species[i]);
        ray[l] = rayleigh_air[b] * ratio * lg.dp_pa / g * VL_AVOGADRO / lg.m_mean_kg_mol;
    }
}

/* Adding from the top for one (i, j) pair: r (from above), t, rs (from below); scat
 * holds each layer's scattering depth (Rayleigh plus cloud). */
static void column_rt(const band_tau *bt, const double *scat, int nl, int i, int j, double *r,
                      double *t, double *rs)
{
    double ra = 0.0, ta = 1.0, rsa = 0.0; /* the stack above, starting empty at the top */
    for (int l = nl - 1; l >= 0; l--) {
        double tabs = bt->grey[l] + line(bt, 0, l, i) + line(bt, 1, l, j);
        double tot = tabs + scat[l], rl, tl;
        layer_rt(tot, tot > 0.0 ? scat[l] / tot : 0.0, &rl, &tl);
        double den = 1.0 / (1.0 - rsa * rl);
        ra = ra + ta * ta * rl * den;
        rsa = rl + tl * tl * rsa * den;
        ta = ta * tl * den;
    }
    *r = ra;
    *t = ta;
    *rs = rsa;
}

static void band_sw(const band_tau *bt, int nl, const double *scat, int k, vl_starlight *sl)
{
    double r = 0.0, t2 = 0.0, rs = 0.0;
    for (int i = 0; i < nint(bt, 0); i++)
        for (int j = 0; j < nint(bt, 1); j++) {
            double w = weight(bt, 0, i) * weight(bt, 1, j), ri, ti, rsi;
            column_rt(bt, scat, nl, i, j, &ri, &ti, &rsi);
            r += w * ri;
            t2 += w * ti * ti;
            rs += w * rsi;
        }
    sl->r[k] = r;
    sl->t2[k] = t2;
    sl->rs[k] = rs;
}

/* Clear and cloudy starlight of band b. */
static void band_starlight(const band_tau *bt, const vl_profile *pr, double g, int b,
                           const double *cloud_sw, vl_radiation_out *out)
{
    int nl = pr->n - 1, k = b - VL_SW_FIRST;
    double ray[NLAYERS], scat[NLAYERS];
    rayleigh_depths(pr, g, b, ray);
    band_sw(bt, nl, ray, k, &out->sw[0]);
    if (!cloud_sw)
        return;
    for (int l = 0; l < nl; l++)
        scat[l] = ray[l] + cloud_sw[l];
    band_sw(bt, nl, scat, k, &out->sw[1]);
}

void vl_radiation_eval(const vl_opacity_scales *s, const vl_profile *pr, double g,
                       const vl_cloud *cl, vl_radiation_out *out)
{
    vl_opacity_layer ol[NLAYERS];
    double none[NLAYERS], cloud_sw[NLAYERS], cloud_lw[NLAYERS];
    int nl = pr->n - 1;
    prepare_layers(pr, g, ol);
    cloud_depths(pr, NULL, 0.0, none);
    cloud_depths(pr, cl, cl ? cl->tau_sw * (1.0 - CLOUD_G) : 0.0, cloud_sw);
    cloud_depths(pr, cl, cl ? cl->tau_lw : 0.0, cloud_lw);
    out->olr[0] = out->olr[1] = 0.0;
    for (int b = 0; b < VL_NBANDS; b++) {
        band_tau bt;
        double bl[VL_PROFILE_LEVELS];
        band_depths(s, nl, ol, b, &bt);
        planck_levels(pr, b, bl);
        out->olr[0] += band_olr(&bt, pr, bl, none);
        out->olr[1] += cl ? band_olr(&bt, pr, bl, cloud_lw) : 0.0;
        if (b >= VL_SW_FIRST)
            band_starlight(&bt, pr, g, b, cl ? cloud_sw : NULL, out);
    }
    if (!cl) {
        out->olr[1] = out->olr[0];
        out->sw[1] = out->sw[0];
    }
}

void vl_radiation_band_albedo(const vl_starlight *sl, const double a[VL_NBANDS],
                              double g[VL_NSW])
{
    for (int b = VL_SW_FIRST; b < VL_NBANDS; b++) {
        int k = b - VL_SW_FIRST;
        g[k] = sl->r[k] + sl->t2[k] * a[b] / (1.0 - a[b] * sl->rs[k]);
    }
}

double vl_radiation_albedo_of(const double share[VL_NBANDS], const double a[VL_NBANDS],
                              const double g[VL_NSW])
{
    double alb = 0.0;
    for (int b = 0; b < VL_SW_FIRST; b++) /* the little starlight below: the surface alone */
        alb += share[b] * a[b];
    for (int b = VL_SW_FIRST; b < VL_NBANDS; b++)
        alb += share[b] * g[b - VL_SW_FIRST];
    return alb;
}

double vl_radiation_albedo(const vl_starlight *sl, const double share[VL_NBANDS],
                           const double a[VL_NBANDS])
{
    double g[VL_NSW];
    vl_radiation_band_albedo(sl, a, g);
    return vl_radiation_albedo_of(share, a, g);
}
