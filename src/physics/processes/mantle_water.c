/* mantle_water.c: exchange of water between the surface and the mantle through plate
 * tectonics, with the seafloor-pressure dependence of Cowan & Abbot 2014 (ApJ 781:27):
 *   regassing  R = x_h rho_c chi d_h(P) A_dot f_liq,
 *              d_h(P) = min(d_h,ref (P/P_ref)^sigma, d_h,max)   (grows with P, saturates)
 *   degassing  D = x_m rho_m d_melt f_degas(P) A_dot,
 *              f_degas(P) = min(f_degas,ref (P/P_ref)^-mu, 1)   (falls with P)
 * P = M_ocean g / A is the seafloor pressure of the condensed surface water spread over
 * the planet (thin shell), x_m = M_mantle_water / M_mantle the mantle's water mass
 * fraction, and A_dot the seafloor production rate (ridge length x spreading rate),
 *   A_dot = A_dot,ref (R_p / R_earth) (Q/Q_ref)^n,
 * with the ridge length scaled as the planet's circumference and the spreading rate as a
 * power of the heat flow. f_liq is the ice-free share of the ocean (env->liquid: 0 when
 * dry, in a runaway or fully frozen), so regassing fades continuously as the ocean
 * freezes; d_h(P) -> 0 as the ocean shrinks does the same for a drying surface.
 * Stagnant lid: no subduction, so no regassing; degassing of the melt of a stagnant-lid
 * volcanism producing a fixed share of the mobile-lid melt at equal heat flow.
 * Off by default until the bundled scenarios set a mantle inventory (with none, the
 * ocean drains into the mantle). Parameter values: docs/cycles.md. */
#include <math.h>
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double x_h;             /* water mass fraction of the hydrated layer */
    double rho_c;           /* crust density, kg/m^3 */
    double chi;             /* share of the subducted water carried past the arc into the mantle */
    double d_h_ref_m;       /* hydrated-layer depth at P_ref */
    double d_h_max_m;       /* deepest hydrated layer */
    double sigma;           /* pressure exponent of the hydrated depth */
    double p_ref_pa;        /* reference seafloor pressure */
    double rho_m;           /* mantle density, kg/m^3 */
    double d_melt_m;        /* depth of the melting column below ridges */
    double f_degas_ref;     /* share of the melt's water degassed at P_ref */
    double mu;              /* pressure exponent of degassing */
    double mantle_share;    /* mantle mass over planet mass */
    double prod_m2_s;       /* seafloor production rate of present Earth, m^2/s */
    double spread_exp;      /* n: spreading rate ~ (Q/Q_ref)^n */
    double stagnant_ratio;  /* stagnant-lid melt production over mobile-lid, at equal heat flow */
} params;

#define R(k, unit, si, d, lo, hi, f, doc, ref) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, NULL)
#define CA14 "Cowan & Abbot 2014, ApJ 781:27"

static const vl_param table[] = {
    R("crust_water_fraction", "", 1.0, 0.05, 0.0, 0.5, x_h,
      "x_h: water mass fraction of the hydrated layer of the subducting plate",
      CA14 " nominal value, from memory"),
    R("crust_density_kg_m3", "kg/m^3", 1.0, 3000.0, 1000.0, 6000.0, rho_c,
      "rho_c: density of the oceanic crust", CA14 " nominal value, from memory"),
    R("regassing_efficiency", "", 1.0, 0.23, 0.0, 1.0, chi,
      "chi: share of the subducted water carried past the arcs into the mantle",
      CA14 " nominal value, from memory; about a third retained to 230 km depth "
           "(van Keken et al. 2011, JGR 116:B01401), from memory"),
    R("hydrated_depth_km", "km", 1e3, 3.0, 0.0, 100.0, d_h_ref_m,
      "d_h,ref: depth of the hydrated layer at the reference seafloor pressure",
      CA14 " nominal Earth value, from memory"),
    R("hydrated_depth_max_km", "km", 1e3, 7.1, 0.0, 100.0, d_h_max_m,
      "d_h,max: the hydrated layer grows with seafloor pressure up to this depth",
      "the oceanic crust, 7.1 +- 0.8 km (White, McKenzie & O'Nions 1992, JGR 97:19683), "
      "from memory; hydration of the mantle below the crust is neglected"),
    R("regassing_pressure_exponent", "", 1.0, 1.0, 0.0, 5.0, sigma,
      "sigma: d_h ~ P^sigma below saturation", CA14 " nominal value, from memory"),
    R("reference_pressure_mpa", "MPa", 1e6, 26.76, 1e-3, 1e5, p_ref_pa,
      "P_ref: seafloor pressure at which d_h,ref and f_degas,ref apply",
      "present Earth as the model measures it: 1 TO x g / (4 pi R^2) = 1.39e21 kg x "
      "9.820 m/s^2 / 5.101e14 m^2 [C] (the ocean spread over the whole planet; the "
      "mean seafloor of the ocean basins is deeper)"),
    R("mantle_density_kg_m3", "kg/m^3", 1.0, 3300.0, 1000.0, 8000.0, rho_m,
      "rho_m: density of the upper mantle that melts below ridges",
      CA14 " nominal value, from memory"),
    R("melt_depth_km", "km", 1e3, 60.0, 0.0, 1000.0, d_melt_m,
      "d_melt: depth of the melting column below ridges (the mantle processed per unit "
      "area of new seafloor)", CA14 " nominal value, from memory"),
    R("degassing_fraction", "", 1.0, 0.9, 0.0, 1.0, f_degas_ref,
      "f_degas,ref: share of the melt's water degassed at the reference pressure",
      CA14 " nominal value, from memory"),
    R("degassing_pressure_exponent", "", 1.0, 1.0, 0.0, 5.0, mu,
      "mu: f_degas ~ P^-mu (capped at 1)",
      CA14 " nominal value, from memory; pressure suppresses the degassing of submarine "
           "lavas (Kite, Manga & Gaidos 2009, ApJ 700:1732, from memory)"),
    R("mantle_mass_share", "", 1.0, 0.67, 0.01, 1.0, mantle_share,
      "mantle mass over planet mass (sets x_m = mantle water / mantle mass)",
      "[C] Earth's mantle 4.0e24 kg (PREM, Dziewonski & Anderson 1981, PEPI 25:297, "
      "from memory) over 5.9722e24 kg (NASA NSSDC Earth fact sheet)"),
    R("seafloor_production_km2_yr", "km^2/yr", 1e6 / VL_YR, 3.0, 0.0, 1e4, prod_m2_s,
      "A_dot,ref: new seafloor per year on present Earth (ridge length x spreading rate); "
      "scaled by R_p/R_earth and (Q/Q_ref)^n",
      "about 3 km^2/yr (Parsons 1982: 3.45; Rowley 2002: ~3), from memory"),
    R("spreading_exponent", "", 1.0, 1.0, 0.0, 3.0, spread_exp,
      "n: spreading rate ~ (Q/Q_ref)^n with Q the interior heat flow",
      "1 (spreading ~ heat flow), common practice; Lehmer et al. 2020 take outgassing "
      "~ Q^m with m = 1-2"),
    R("stagnant_melt_ratio", "", 1.0, 0.05, 0.0, 1.0, stagnant_ratio,
      "stagnant lid: melt production over that of ridges at equal heat flow "
      "(degassing only, no regassing)",
      "Venus's volcanic output of order 1 km^3/yr against ~20 km^3/yr of ridge crust on "
      "Earth (Crisp 1984, JVGR 20:177), from memory; order of magnitude"),
};

enum { COL_REGAS, COL_DEGAS };
static const vl_flux_column columns[] = {
    {"water_regassing_kg_s", "water carried into the mantle by hydrated subducting crust"},
    {"water_degassing_kg_s", "mantle water degassed at ridges"},
};

enum { WATER_TO_MANTLE_WATER, MANTLE_WATER_TO_WATER };
static const vl_transfer transfers[] = {
    [WATER_TO_MANTLE_WATER] = {VL_R_WATER, VL_R_MANTLE_WATER},
    [MANTLE_WATER_TO_WATER] = {VL_R_MANTLE_WATER, VL_R_WATER},
};

/* Seafloor production rate, m^2/s: A_dot,ref (R_p/R_earth) (Q/Q_ref)^n. */
static double production(const params *p, const vl_planet *pl, const vl_env *env)
{
    double q = env->heat_flow_rel > 0.0 ? env->heat_flow_rel : 0.0;
    return p->prod_m2_s * (pl->radius_m / VL_R_EARTH) * pow(q, p->spread_exp);
}

/* Hydrated-layer depth at seafloor pressure P, m (Cowan & Abbot 2014). */
static double hydrated_depth(const params *p, double p_pa)
{
    if (p_pa <= 0.0)
        return p->sigma > 0.0 ? 0.0 : fmin(p->d_h_ref_m, p->d_h_max_m);
    return fmin(p->d_h_ref_m * pow(p_pa / p->p_ref_pa, p->sigma), p->d_h_max_m);
}

/* Share of the melt's water degassed at seafloor pressure P (Cowan & Abbot 2014). */
static double degassed_share(const params *p, double p_pa)
{
    if (p_pa <= 0.0)
        return p->mu > 0.0 ? 1.0 : p->f_degas_ref;
    return fmin(p->f_degas_ref * pow(p_pa / p->p_ref_pa, -p->mu), 1.0);
}

/* Regassing (mobile lid, with liquid water) and degassing, Cowan & Abbot 2014 forms. */
static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const double *y = v->y;
    const vl_env *env = v->env;
    const vl_planet *pl = v->planet;
    const params *p = pv;
    double a_dot = production(p, pl, env);
    double p_sea = (env->ocean_kg > 0.0 ? env->ocean_kg : 0.0) * env->g / env->area_m2;
    int mobile = pl->tectonics == VL_TECTONICS_MOBILE;
    if (mobile && env->liquid > 0.0) {
        double regas = p->x_h * p->rho_c * p->chi * hydrated_depth(p, p_sea) * a_dot * env->liquid;
        vl_flux_transfer(fx, WATER_TO_MANTLE_WATER, regas, COL_REGAS);
    }
    double x_m = (y[VL_R_MANTLE_WATER] > 0.0 ? y[VL_R_MANTLE_WATER] : 0.0) /
                 (p->mantle_share * pl->mass_kg);
    double degas = x_m * p->rho_m * p->d_melt_m * degassed_share(p, p_sea) * a_dot *
                   (mobile ? 1.0 : p->stagnant_ratio);
    vl_flux_transfer(fx, MANTLE_WATER_TO_WATER, degas, COL_DEGAS);
}

const vl_process vl_process_mantle_water = {
    .name = "mantle_water",
    .summary = "water regassing at subduction zones and degassing at ridges, set by seafloor "
               "pressure and spreading rate",
    .refs = "Cowan & Abbot 2014, ApJ 781:27",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 0,
    .rates = rates,
};
