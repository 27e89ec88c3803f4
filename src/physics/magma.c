/* magma.c: a 0-D magma ocean (magma.h): melting curves, adiabat, melt in the mantle,
 * solubilities, iron oxidation.
 *
 * Melting curves (P in GPa): each has a low-pressure branch, a quadratic in P (degC), and
 * a high-pressure Simon-type branch T0 (P/a + 1)^(1/c) (K); below 8 GPa the curve is the
 * low branch, above 14 GPa the high one, and in between T = (1-w) T_low + w T_high with
 * the smoothstep w = 3s^2 - 2s^3, s = (P - 8)/(14 - 8): continuous with a continuous
 * slope (w' = 0 at both ends). The window is centred where the branches meet: the two
 * solidus fits cross at ~10 and ~12 GPa (within 50 K over the window), and the liquidus
 * fits touch at ~11 GPa (within 100 K).
 *
 * Melt in the mantle: with x(p) = (T_ad - T_sol)/(T_liq - T_sol) the local melt fraction
 * is clamp(x, 0, 1). The mantle splits at the pressures where the adiabat crosses the
 * solidus or the liquidus into solid, partly molten and molten pieces; molten pieces
 * count whole (analytic r^2 integral), partly molten ones by 12-point Gauss-Legendre
 * quadrature in depth. Their ends are found by root finding, so melt_kg and
 * dmelt_dtp = integral of rho exp(k p)/(T_liq - T_sol) over the partly molten pieces
 * (the moving ends add nothing: the integrand of melt_kg is continuous there) are
 * continuous in tp. The crossings are zeros of G(p) = ln tp + k p - ln T_m(p), k =
 * alpha/(rho cp); G' = k - T_m'/T_m does not depend on tp, and between the breakpoints
 * below T_m'/T_m is monotone (tests/test_magma.c checks it), so each stretch between
 * breakpoints holds at most one extremum of G and two zeros, all found: the pieces are
 * exact whatever tp. */
#include "volev/magma.h"

#include <float.h>
#include <math.h>
#include <string.h>

#include "volev/units.h"

#define GPA 1e9
#define JOIN_LO_GPA 8.0
#define JOIN_HI_GPA 14.0
#define ZERO_C_K 273.15

/* A melting curve: low branch q0 + q1 P + q2 P^2 (degC, P in GPa), high branch
 * t0 (P/a + 1)^(1/c) (K). */
typedef struct {
    double q0, q1, q2;
    double t0, a, c;
} curve;

/* Solidus: Hirschmann 2000 (G3 1, 2000GC000070; fitted to 0-10 GPa) and Andrault
 * et al. 2011 (EPSL 304:251; chondritic mantle, to 135 GPa; from memory). */
static const curve solidus = {1120.661, 132.899, -5.104, 2045.0, 92.0, 1.3};
/* Liquidus: Katz, Spiegelman & Langmuir 2003 (G3 4:1073, from memory; low
 * pressures) and Fiquet et al. 2010 (Science 329:1516, to 140 GPa; from memory). */
static const curve liquidus = {1780.0, 45.0, -2.0, 1940.0, 29.0, 1.9};

/* Pressures, GPa, between which T_m'/T_m of both curves is monotone: the blend window's
 * ends and the extrema of T_m'/T_m inside it ([C]: solidus 11.942 and 13.612, liquidus
 * 9.365 and 13.179 GPa). Below 8 GPa the branches are concave quadratics rising (T'/T
 * falls), above 14 GPa Simon laws (T'/T = 1/(c (P + a)) falls). */
static const double breaks_gpa[] = {JOIN_LO_GPA, 9.36467402085705, 11.9419219846878,
                                    13.1788947371064, 13.6117837097243, JOIN_HI_GPA};
#define NBREAKS ((int)(sizeof breaks_gpa / sizeof breaks_gpa[0]))

/* T (K) of curve cv at p_pa and its slope dT/dp (K/Pa) in *dt. */
static double curve_eval(const curve *cv, double p_pa, double *dt)
{
    double p = p_pa < 0.0 ? 0.0 : p_pa / GPA; /* NaN stays NaN */
    double tl = 0.0, dl = 0.0, th = 0.0, dh = 0.0;
    if (p < JOIN_HI_GPA) {
        tl = ZERO_C_K + cv->q0 + p * (cv->q1 + cv->q2 * p);
        dl = cv->q1 + 2.0 * cv->q2 * p;
    }
    if (p > JOIN_LO_GPA) {
        th = cv->t0 * pow(p / cv->a + 1.0, 1.0 / cv->c);
        dh = th / (cv->c * (p + cv->a));
    }
    double t, d;
    if (p <= JOIN_LO_GPA) {
        t = tl;
        d = dl;
    } else if (p >= JOIN_HI_GPA) {
        t = th;
        d = dh;
    } else {
        double width = JOIN_HI_GPA - JOIN_LO_GPA, s = (p - JOIN_LO_GPA) / width;
        double w = s * s * (3.0 - 2.0 * s), dw = 6.0 * s * (1.0 - s) / width;
        t = tl + w * (th - tl);
        d = dl + w * (dh - dl) + dw * (th - tl);
    }
    *dt = d / GPA;
    return t;
}

double vl_magma_solidus_k(double p_pa)
{
    double d;
    return curve_eval(&solidus, p_pa, &d);
}

double vl_magma_liquidus_k(double p_pa)
{
    double d;
    return curve_eval(&liquidus, p_pa, &d);
}

/* k = alpha / (rho cp), 1/Pa: the adiabat's d ln T / dp. */
static double adiabat_k(const vl_magma_params *mp)
{
    return mp->alpha_k / (mp->rho_kg_m3 * mp->cp_j_kg_k);
}

double vl_magma_adiabat_k(const vl_magma_params *mp, double tp_k, double p_pa)
{
    return tp_k * exp(adiabat_k(mp) * p_pa);
}

/* The unclamped fraction x at p on the adiabat tp e^(k p); d x / d tp in *dx (if not NULL). */
static double frac_raw(double tp, double k, double p, double *dx)
{
    double d, e = exp(k * p);
    double ts = curve_eval(&solidus, p, &d), tl = curve_eval(&liquidus, p, &d);
    if (dx)
        *dx = e / (tl - ts);
    return (tp * e - ts) / (tl - ts);
}

static double clamp01(double x)
{
    return x < 0.0 ? 0.0 : (x > 1.0 ? 1.0 : x);
}

double vl_magma_melt_frac(const vl_magma_params *mp, double tp_k, double p_pa)
{
    return clamp01(frac_raw(tp_k, adiabat_k(mp), p_pa, NULL));
}

typedef double (*fn1)(double x, const void *ctx);

/* A zero of f in [a, b] where fa = f(a) and fb = f(b) do not have the same strict sign,
 * to |error| <= tol: Brent's method (Brent 1973, Algorithms for Minimization without
 * Derivatives, ch. 4, the procedure zero), deterministic, at most 200 evaluations. */
static double zero_in(fn1 f, const void *ctx, double a, double b, double fa, double fb, double tol)
{
    if (fa == 0.0)
        return a;
    double c = a, fc = fa, d = b - a, e = d;
    for (int it = 0; it < 200; it++) {
        if (fabs(fc) < fabs(fb)) {
            a = b, b = c, c = a;
            fa = fb, fb = fc, fc = fa;
        }
        double tol1 = 2.0 * DBL_EPSILON * fabs(b) + 0.5 * tol, xm = 0.5 * (c - b);
        if (fabs(xm) <= tol1 || fb == 0.0)
            break;
        double dn = xm, en = xm; /* bisection unless interpolation is acceptable */
        if (fabs(e) >= tol1 && fabs(fa) > fabs(fb)) {
            double s = fb / fa, p, q;
            if (a == c) {
                p = 2.0 * xm * s;
                q = 1.0 - s;
            } else {
                double qa = fa / fc, r = fb / fc;
                p = s * (2.0 * xm * qa * (qa - r) - (b - a) * (r - 1.0));
                q = (qa - 1.0) * (r - 1.0) * (s - 1.0);
            }
            q = p > 0.0 ? -q : q;
            p = fabs(p);
            if (2.0 * p < 3.0 * xm * q - fabs(tol1 * q) && p < fabs(0.5 * e * q)) {
                en = d;
                dn = p / q;
            }
        }
        d = dn, e = en;
        a = b, fa = fb;
        b += fabs(d) > tol1 ? d : (xm > 0.0 ? tol1 : -tol1);
        fb = f(b, ctx);
        if ((fb > 0.0) == (fc > 0.0)) {
            c = a, fc = fa;
            d = e = b - a;
        }
    }
    return b;
}

/* 12-point Gauss-Legendre rule on [-1, 1]: the non-negative nodes and their weights
 * ([C]: Newton iteration on the Legendre polynomial P_12, to double precision). */
#define NGL 12
static const double gl_t[NGL / 2] = {0.12523340851146894, 0.36783149899818018,
                                     0.58731795428661748, 0.76990267419430469,
                                     0.90411725637047480, 0.98156063424671924};
static const double gl_w[NGL / 2] = {0.24914704581340288, 0.23349253653835478,
                                     0.20316742672306584, 0.16007832854334633,
                                     0.10693932599531857, 0.04717533638651184};

/* Node i (0..NGL-1, ascending) of the rule and its weight in *w. */
static double gl_node(int i, double *w)
{
    int j = i < NGL / 2 ? NGL / 2 - 1 - i : i - NGL / 2;
    *w = gl_w[j];
    return i < NGL / 2 ? -gl_t[j] : gl_t[j];
}

/* G(p) = ln tp + k p - ln T_m(p) of one melting curve: > 0 where the adiabat is above it. */
typedef struct {
    const curve *cv;
    double ln_tp, k;
} crossing;

static double g_val(double p, const void *ctx)
{
    const crossing *g = ctx;
    double d;
    return g->ln_tp + g->k * p - log(curve_eval(g->cv, p, &d));
}

/* G'(p) = k - T_m'/T_m, independent of tp. */
static double g_slope(double p, const void *ctx)
{
    const crossing *g = ctx;
    double d, t = curve_eval(g->cv, p, &d);
    return g->k - d / t;
}

/* Appends to ev[n] the zero of G in [a, b] if G(a) = fa and G(b) = fb straddle it. */
static int bracket(const crossing *g, double a, double b, double fa, double fb, double tol,
                   double *ev, int n)
{
    if ((fa > 0.0) != (fb > 0.0))
        ev[n++] = zero_in(g_val, g, a, b, fa, fb, tol);
    return n;
}

/* Appends to ev the zeros of G in [a, b], where G' is monotone: G has at most one
 * extremum there (the zero of G'), so at most two zeros, one on each side of it. With
 * G(a) and G(b) of opposite signs there is exactly one; with the same sign, two or none,
 * which only an extremum turned towards 0 can tell. */
static int stretch_zeros(const crossing *g, double a, double b, double tol, double *ev, int n)
{
    double ga = g_val(a, g), gb = g_val(b, g);
    double da = g_slope(a, g), db = g_slope(b, g);
    if (da * db < 0.0 && (ga > 0.0) == (gb > 0.0) && (ga > 0.0) == (da < 0.0)) {
        double m = zero_in(g_slope, g, a, b, da, db, tol), gm = g_val(m, g);
        n = bracket(g, a, m, ga, gm, tol, ev, n);
        return bracket(g, m, b, gm, gb, tol, ev, n);
    }
    return bracket(g, a, b, ga, gb, tol, ev, n);
}

/* Sorts v[0..n-1] ascending (insertion sort: n is small). */
static void sort_small(double *v, int n)
{
    for (int i = 1; i < n; i++) {
        double x = v[i];
        int j = i;
        for (; j > 0 && v[j - 1] > x; j--)
            v[j] = v[j - 1];
        v[j] = x;
    }
}

#define MAXEV 48 /* 2 ends, 6 breaks, <= 2 zeros x 7 stretches x 2 curves, the front */

/* The pressures that cut [0, pmax] into pieces of one kind (solid, partly molten,
 * molten), ascending in ev: the ends, the breakpoints inside, and every crossing of the
 * adiabat tp e^(k p) with the solidus and the liquidus. Returns their number. */
static int cut_points(double tp, double k, double pmax, double tol, double *ev)
{
    double nodes[NBREAKS + 2];
    int nn = 0, n = 0;
    nodes[nn++] = 0.0;
    for (int i = 0; i < NBREAKS; i++)
        if (breaks_gpa[i] * GPA < pmax)
            nodes[nn++] = breaks_gpa[i] * GPA;
    nodes[nn++] = pmax;
    for (int i = 0; i < nn; i++)
        ev[n++] = nodes[i];
    for (int c = 0; c < 2; c++) {
        crossing g = {c == 0 ? &solidus : &liquidus, log(tp), k};
        for (int i = 0; i + 1 < nn; i++)
            n = stretch_zeros(&g, nodes[i], nodes[i + 1], tol, ev, n);
    }
    sort_small(ev, n);
    return n;
}

enum { SOLID, PARTIAL, MOLTEN };

/* The kind of the piece [a, b] (no crossing inside): from x at its middle. */
static int piece_kind(double tp, double k, double a, double b)
{
    double x = frac_raw(tp, k, 0.5 * (a + b), NULL);
    return x <= 0.0 ? SOLID : (x >= 1.0 ? MOLTEN : PARTIAL);
}

/* x - phi at p on the adiabat (the rheological front is its zero). */
typedef struct {
    double tp, k, phi;
} front;

static double front_val(double p, const void *ctx)
{
    const front *f = ctx;
    return frac_raw(f->tp, f->k, p, NULL) - f->phi;
}

/* Where x first falls below phi in the partly molten piece [a, b] (x(a) >= phi), by
 * sampling x at the quadrature nodes and b and a zero in the first bracket; -1 if x
 * stays at or above phi at every sample. */
static double front_in_piece(const front *f, double a, double b, double tol)
{
    double pa = a, fa = front_val(a, f);
    for (int i = 0; i <= NGL; i++) {
        double w, p = i < NGL ? 0.5 * (a + b) + 0.5 * (b - a) * gl_node(i, &w) : b;
        double fp = front_val(p, f);
        if (fp < 0.0)
            return zero_in(front_val, f, pa, p, fa, fp, tol);
        pa = p, fa = fp;
    }
    return -1.0;
}

/* Pressure of the magma ocean's base: where the melt fraction first falls to phi going
 * down from the surface (0 if it is below phi there, the last cut point if never). */
static double front_pressure(const front *f, const double *ev, const int *kind, int n, double tol)
{
    if (front_val(0.0, f) < 0.0)
        return 0.0;
    for (int i = 0; i + 1 < n; i++) {
        if (kind[i] == MOLTEN || !(ev[i + 1] > ev[i]))
            continue;
        if (kind[i] == SOLID)
            return ev[i];
        double p = front_in_piece(f, ev[i], ev[i + 1], tol);
        if (p >= 0.0)
            return p;
    }
    return ev[n - 1];
}

/* Inserts p into the ascending ev[0..n-1] if it lies strictly inside; the new count. */
static int insert_cut(double *ev, int n, double p)
{
    if (!(p > ev[0] && p < ev[n - 1]))
        return n;
    ev[n++] = p;
    sort_small(ev, n);
    return n;
}

/* The mantle shell: planet radius, density, rho g, and the adiabat. */
typedef struct {
    double r, rho, rho_g, tp, k;
} shell;

/* Mass of the spherical shell between depths za < zb. */
static double shell_mass(const shell *sh, double za, double zb)
{
    double ra = sh->r - za, rb = sh->r - zb;
    return 4.0 / 3.0 * VL_PI * sh->rho * (ra * ra * ra - rb * rb * rb);
}

/* Melt mass in the piece [a, b] (pressures) of the given kind, and its derivative with
 * respect to tp in *dm (0 unless partly molten: the ends' motion adds nothing). */
static double piece_melt(const shell *sh, double a, double b, int kind, double *dm)
{
    double za = a / sh->rho_g, zb = b / sh->rho_g, m = 0.0;
    *dm = 0.0;
    if (kind == MOLTEN)
        return shell_mass(sh, za, zb);
    if (kind == SOLID || !(zb > za))
        return 0.0;
    double zm = 0.5 * (za + zb), hz = 0.5 * (zb - za);
    for (int i = 0; i < NGL; i++) {
        double w, z = zm + hz * gl_node(i, &w), r = sh->r - z, dx;
        double x = frac_raw(sh->tp, sh->k, z * sh->rho_g, &dx);
        double f = w * 4.0 * VL_PI * sh->rho * r * r * hz;
        m += f * x;
        *dm += f * dx;
    }
    return m;
}

/* Mass-weighted mean of exp(k p) over the shell down to depth h (quadrature). */
static double mean_factor(const shell *sh, double h)
{
    double zm = 0.5 * h, num = 0.0, den = 0.0;
    for (int i = 0; i < NGL; i++) {
        double w, z = zm + zm * gl_node(i, &w), r = sh->r - z;
        num += w * r * r * exp(sh->k * sh->rho_g * z);
        den += w * r * r;
    }
    return num / den;
}

static int positive(double x)
{
    return x > 0.0 && x < INFINITY;
}

/* Whether the parameters and the planet are valid (magma.h, vl_magma_state_at). */
static int inputs_ok(const vl_magma_params *mp, double tp, double r, double g)
{
    if (!mp || !positive(tp) || !positive(r) || !positive(g))
        return 0;
    if (!positive(mp->rho_kg_m3) || !positive(mp->cp_j_kg_k) || !positive(mp->alpha_k))
        return 0;
    if (!(mp->latent_j_kg >= 0.0 && mp->latent_j_kg < INFINITY))
        return 0;
    if (!(mp->phi_rheo > 0.0 && mp->phi_rheo < 1.0))
        return 0;
    return mp->core_radius_frac >= 0.0 && mp->core_radius_frac < 1.0;
}

/* Integrates the melt over the pieces cut by ev, the part below the front pf apart. */
static void integrate_melt(const shell *sh, const double *ev, int n, double pf,
                           vl_magma_state *out)
{
    for (int i = 0; i + 1 < n; i++) {
        if (!(ev[i + 1] > ev[i]))
            continue;
        double dm, m = piece_melt(sh, ev[i], ev[i + 1], piece_kind(sh->tp, sh->k, ev[i], ev[i + 1]), &dm);
        out->melt_kg += m;
        out->dmelt_dtp_kg_k += dm;
        if (0.5 * (ev[i] + ev[i + 1]) > pf)
            out->deep_melt_kg += m;
    }
}

int vl_magma_state_at(const vl_magma_params *mp, double tp_k, double r_m, double g,
                      vl_magma_state *out)
{
    if (!out)
        return -1;
    memset(out, 0, sizeof *out);
    if (!inputs_ok(mp, tp_k, r_m, g))
        return -1;
    double h = r_m * (1.0 - mp->core_radius_frac);
    shell sh = {r_m, mp->rho_kg_m3, mp->rho_kg_m3 * g, tp_k, adiabat_k(mp)};
    double pmax = sh.rho_g * h, tol = 1e-12 * pmax;
    double ev[MAXEV];
    int kind[MAXEV];
    int n = cut_points(tp_k, sh.k, pmax, tol, ev);
    for (int i = 0; i + 1 < n; i++)
        kind[i] = piece_kind(tp_k, sh.k, ev[i], ev[i + 1]);
    front fr = {tp_k, sh.k, mp->phi_rheo};
    double pf = front_pressure(&fr, ev, kind, n, tol);
    n = insert_cut(ev, n, pf);
    integrate_melt(&sh, ev, n, pf, out);
    out->melt_frac_surface = clamp01(frac_raw(tp_k, sh.k, 0.0, NULL));
    out->depth_m = pf / sh.rho_g;
    out->p_base_pa = pf;
    out->p_cmb_pa = pmax;
    out->mantle_kg = shell_mass(&sh, 0.0, h);
    out->adiabat_factor = mean_factor(&sh, h);
    out->heat_capacity_j_k = out->mantle_kg * mp->cp_j_kg_k * out->adiabat_factor +
                             mp->latent_j_kg * out->dmelt_dtp_kg_k;
    return 0;
}

/* Lebrun et al. 2013 (JGR Planets 118:1155), after Carroll & Holloway 1994 and Papale
 * 1997: X = 6.8e-8 p^0.7, p in Pa (from memory). */
double vl_magma_h2o_solubility(double p_h2o_pa)
{
    return p_h2o_pa > 0.0 ? 6.8e-8 * pow(p_h2o_pa, 0.7) : 0.0;
}

/* Pan, Holloway & Hervig 1991 (GCA 55:1587), as used by Lebrun et al. 2013: X = 4.4e-12 p,
 * p in Pa (from memory). */
double vl_magma_co2_solubility(double p_co2_pa)
{
    return p_co2_pa > 0.0 ? 4.4e-12 * p_co2_pa : 0.0;
}

/* Libourel, Marty & Humbert 2003 (GCA 67:4123), in mass fraction with p and fO2 in bar:
 * X = 6.11e-8 p + 5.97e-16 fO2^(-3/4) p^(1/2) (from memory: 0.0611 ppm per bar of
 * physically dissolved N2, and the nitride term). */
double vl_magma_n2_solubility(double p_n2_pa, double fo2_bar)
{
    if (!(p_n2_pa > 0.0))
        return 0.0;
    double p_bar = p_n2_pa / VL_BAR;
    double x = 6.11e-8 * p_bar;
    if (positive(fo2_bar))
        x += 5.97e-16 * pow(fo2_bar, -0.75) * sqrt(p_bar);
    return x;
}

/* One O per two FeO: x_feo / M(FeO) / 2 * M(O), standard atomic weights. */
double vl_magma_o_capacity(double x_feo)
{
    if (!(x_feo > 0.0))
        return 0.0;
    return 0.5 * x_feo / (VL_MAGMA_AW_FE + VL_AW_O) * VL_AW_O;
}

double vl_magma_fe3_ratio(double o_kg, double melt_kg, double x_feo)
{
    double cap = vl_magma_o_capacity(x_feo) * melt_kg;
    if (!(o_kg > 0.0) || !(cap > 0.0))
        return 0.0;
    return o_kg >= cap ? 1.0 : o_kg / cap;
}
