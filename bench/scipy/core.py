#!/usr/bin/env python3
"""core.py -- the core equations of volev, re-implemented for SciPy's solve_ivp.

The configuration is bench/scipy/core.cfg: an Earth-like planet on the Sun's analytic
track (Gough 1981) with the solar XUV history (Ribas et al. 2005), the hz_fit climate,
and five processes, in volev's registry order: hydrogen_escape, photolysis,
oxygen_sink, outgassing, weathering. Everything volev computes for them on the way is
transcribed here operation by operation from the C sources (src/engine/model.c, src/engine/flux.c,
src/physics/star.c, src/physics/interior.c, src/physics/ocean.c, src/physics/climate.c, src/physics/climate_hzfit.c,
src/physics/water.c, src/physics/upper.c and the five process files), in the same order, so that the
right-hand side agrees with volev's to rounding:

  environment: star (luminosity, Teff, XUV), orbit-averaged fluxes, radiogenic heat
  flow; the ocean-atmosphere CO2 split in two passes (288 K, then the climate's surface
  temperature) with the same bracketed Illinois false-position solve; the hz_fit energy
  balance, saturated vapour (Wagner & Pruss / Murphy & Koop), ice-free share,
  stratospheric hydrogen; mole fractions and mean masses; the exobase (temperature,
  heights, thermosphere-base density) for the Jeans limit;
  escape: least of the diffusion, Jeans and energy limits with the hydrodynamic blend,
  and the deuterium fractionation blend;
  fluxes: the depletion ramp of src/engine/flux.c on every outflow, deuterium carried with
  hydrogen, the balanced photolysis reaction.

The state is volev's whole 23-reservoir vector (reservoirs no core process touches
stay at zero), so the error norm of the solver runs over the same components with the
same weights: atol_i = run.abs_tolerance_kg x floor_i / 1e3 kg, rtol = run.rel_tolerance
(src/engine/integrate.c passes floor/1e3 as the absolute-tolerance scale of GSL's scaled
control). Parameter values are read from the resolved scenario volev writes
(scenario.resolved.cfg), in file units times the same SI factors volev uses, so both
programs start from bit-identical inputs.

The run must stay in one regime: the core is integrated in the temperate regime, and
after the solve every accepted step is classified with the hz_fit rules; a step that
would have left the temperate regime is reported (exit 1), since volev would have
located and handled an event there.

Each method runs twice: with SciPy's own finite-difference Jacobian (num_jac, "num")
and with volev's forward differences passed as jac= ("fd"). A tight Radau run
(--reference: rtol and atol divided by 1e4) measures the global error of each run.

Usage (bench/scipy/compare.sh drives it; --help lists every option):
  /usr/bin/python3 core.py RESOLVED_CFG [--volev-dir DIR] [--methods BDF,LSODA,Radau]
      [--jacobians num,fd] [--repeat N] [--reference] [--factor F] [--max-rhs N]
      [--volev-ms MS --volev-steps N --volev-rhs N] [--out DIR]
Exit status: 0 agreement (or no comparison asked); 1 if the right-hand side differs from
volev's, a run leaves the temperate regime, or volev's trajectory differs from the
reference (without --reference: from a SciPy run with the fd Jacobian) by more than
F (default 1000) local error weights atol_i + rtol |y_i| at a shared output age;
2 bad arguments or input.
"""
import argparse
import math
import os
import statistics
import sys
import time
import warnings

try:
    import numpy as np
    from scipy.integrate import solve_ivp
except ImportError as exc:  # pragma: no cover
    sys.stderr.write("core.py: needs numpy and scipy (%s)\n" % exc)
    sys.exit(2)

# ---------------------------------------------------------------- constants (units.h)
G_NEWTON = 6.67430e-11
K_BOLTZMANN = 1.380649e-23
SIGMA_SB = 5.670374419e-8
AMU = 1.66053906660e-27
AVOGADRO = 6.02214076e23
L_SUN = 3.828e26
GM_SUN = 1.3271244e20
M_SUN = GM_SUN / G_NEWTON
AU = 1.495978707e11
YR = 3.15576e7
M_EARTH = 5.9722e24
R_EARTH = 6.371e6
S_EARTH = 1361.0
TO_KG = 1.39e21
BAR = 1.0e5
PI = 3.14159265358979323846
AW_H, AW_C, AW_N, AW_O, AW_D = 1.008, 12.011, 14.007, 15.999, 2.014101778

# water.h, ocean.h, flux.h, upper.h, interior.h
WATER_TC_K = 647.096
WATER_PC_PA = 22.064e6
WATER_TTRIPLE_K = 273.16
OCEAN_DENSITY = 1000.0
HENRY_298 = 3.3e-4
HENRY_DT_K = 2400.0
HENRY_REF_K = 298.15
DIC_REF_MOL_KG = 2.3e-3
PCO2_REF_PA = 28.37
OCEAN_T_REF_K = 288.0
OCEAN_FIRST_PASS_K = 288.0
DRAIN_TIME_S = 1.0e6
F_XUV_EARTH = 4.6e-3
HALF_LIFE_GYR = (4.468, 0.7038, 14.05, 1.248)  # U-238, U-235, Th-232, K-40
GYR_S = 1.0e9 * YR

# ---------------------------------------------------------------- species, reservoirs
# species: (H, C, N, O, D) atoms, in enum vl_species order
SPECIES = {
    "H2O": (2, 0, 0, 1, 0), "CO2": (0, 1, 0, 2, 0), "N2": (0, 0, 2, 0, 0),
    "H2": (2, 0, 0, 0, 0), "O2": (0, 0, 0, 2, 0), "H": (1, 0, 0, 0, 0),
    "C": (0, 1, 0, 0, 0), "N": (0, 0, 1, 0, 0), "O": (0, 0, 0, 1, 0), "D": (0, 0, 0, 0, 1),
}


def _molar(sp):
    h, c, n, o, d = SPECIES[sp]
    return (h * AW_H + c * AW_C + n * AW_N + o * AW_O + d * AW_D) * 1e-3


MOLAR = {sp: _molar(sp) for sp in SPECIES}

# (name, species, floor kg), in VL_RESERVOIRS order
RESERVOIRS = [
    ("surface_water", "H2O", 1.0e9), ("mantle_water", "H2O", 1.0e9),
    ("surface_co2", "CO2", 1.0e6), ("carbonate_rock", "CO2", 1.0e6),
    ("mantle_carbon", "CO2", 1.0e6), ("atm_n2", "N2", 1.0e6),
    ("mantle_nitrogen", "N2", 1.0e6), ("atm_h2", "H2", 1.0e3), ("atm_o2", "O2", 1.0e3),
    ("oxidised_rock", "O", 1.0e3), ("space_h", "H", 1.0e3), ("space_c", "C", 1.0e3),
    ("space_n", "N", 1.0e3), ("space_o", "O", 1.0e3), ("space_d", "D", 1.0),
    ("impactor_water", "H2O", 1.0e9), ("impactor_co2", "CO2", 1.0e6),
    ("impactor_n2", "N2", 1.0e6), ("crust_nitrogen", "N2", 1.0e6),
    ("surface_water_d", "D", 1.0), ("mantle_water_d", "D", 1.0), ("atm_h2_d", "D", 1.0),
    ("impactor_water_d", "D", 1.0),
]
NRES = len(RESERVOIRS)
R = {name: i for i, (name, _, _) in enumerate(RESERVOIRS)}
FLOOR = [fl for (_, _, fl) in RESERVOIRS]
RES_MOLAR = [MOLAR[sp] for (_, sp, _) in RESERVOIRS]
DEUTERIUM = {R["surface_water"]: R["surface_water_d"], R["mantle_water"]: R["mantle_water_d"],
             R["atm_h2"]: R["atm_h2_d"], R["impactor_water"]: R["impactor_water_d"],
             R["space_h"]: R["space_d"]}
RES_H_ATOMS = [SPECIES[sp][0] for (_, sp, _) in RESERVOIRS]


def element_fraction_h(r):
    sp = RESERVOIRS[r][1]
    return SPECIES[sp][0] * AW_H * 1e-3 / MOLAR[sp]


# gases, enum vl_gas order
GAS_H2O, GAS_CO2, GAS_N2, GAS_O2, GAS_H2 = range(5)
GAS_MOLAR = [MOLAR["H2O"], MOLAR["CO2"], MOLAR["N2"], MOLAR["O2"], MOLAR["H2"]]

# hz_fit climate (src/physics/climate_hzfit.c)
K2013_RUNAWAY = (1.0385, 1.2456e-4, 1.4612e-8, -7.6345e-12, -1.7511e-15)
K2013_MOIST = (1.0146, 8.1884e-5, 1.9394e-9, -4.3618e-12, -6.8260e-16)
K2014_MASS = (0.1, 1.0, 5.0)
K2014_RUNAWAY = ((0.99, 1.209e-4, 1.404e-8, -7.418e-12, -1.713e-15),
                 (1.107, 1.332e-4, 1.580e-8, -8.308e-12, -1.931e-15),
                 (1.188, 1.433e-4, 1.707e-8, -8.968e-12, -2.084e-15))

# the processes of the core, in registry order; every other one must be off
CORE = ("hydrogen_escape", "photolysis", "oxygen_sink", "outgassing", "weathering")
KNOWN = ("hydrogen_escape", "oxygen_drag", "photolysis", "jeans_oxygen", "oxygen_sink",
         "outgassing", "weathering", "impacts", "ion_pickup", "sputtering",
         "photochemical_escape", "polar_outflow", "mantle_water", "nitrogen_regassing",
         "nitrogen_burial", "seafloor_weathering", "carbonate_recycling", "crust_oxidation",
         "magma_freezing", "magma_oxidation", "volcanic_reductants", "h2_oxidation",
         "photochemical_h2", "rock_oxidation")

REGIME_NAMES = ("dry", "frozen", "temperate", "moist_greenhouse", "runaway")
TEMPERATE = 2


class InputError(Exception):
    pass


class Stalled(Exception):
    """Raised from the right-hand side when a solve exceeds its evaluation budget."""

    def __init__(self, t, calls):
        super().__init__("gave up at %.6g yr after %d RHS evaluations" % (t / YR, calls))
        self.t, self.calls = t, calls


SQRT_EPS = math.sqrt(sys.float_info.epsilon)


# ---------------------------------------------------------------- resolved scenario
def read_resolved(path):
    """Key -> text value from volev's resolved-scenario writer (nested 'name = {' groups,
    'key = value;' rows, '#' comments)."""
    values, stack = {}, []
    with open(path, encoding="utf-8") as f:
        for raw in f:
            line = raw.split("#", 1)[0].strip()
            if not line:
                continue
            if line.endswith("= {"):
                stack.append(line[:-3].strip())
            elif line in ("};", "}"):
                if not stack:
                    raise InputError("%s: unbalanced braces" % path)
                stack.pop()
            elif line.endswith(";") and "=" in line:
                key, val = line[:-1].split("=", 1)
                values[".".join(stack + [key.strip()])] = val.strip()
    return values


class Params:
    """The scenario values the core uses, in SI, converted with volev's factors."""

    def __init__(self, v):
        self.v = v

        def real(key, to_si=1.0):
            if key not in v:
                raise InputError("resolved scenario lacks %s" % key)
            return float(v[key]) * to_si

        def text(key):
            if key not in v:
                raise InputError("resolved scenario lacks %s" % key)
            return v[key].strip('"')

        def flag(key):
            return text(key) == "true"

        # choices the transcription covers
        need = {"star.luminosity_model": "sun_analytic", "star.xuv.model": "solar_ribas",
                "climate.model": "hz_fit", "planet.interior.heat_flow_model": "radiogenic",
                "planet.interior.tectonics": "mobile_lid",
                "processes.photolysis.photon_limited": "false",
                "escape.radiative_cooling": "false",
                "escape.thermal": "true", "escape.oxygen_drag": "false",
                "processes.weathering.runoff": "false"}
        for key, want in need.items():
            if text(key) != want:
                raise InputError("core.py implements %s = %s only (got %s)" % (key, want, text(key)))
        for name in KNOWN:
            on = flag("processes.%s.enabled" % name)
            if on != (name in CORE):
                raise InputError("core.py needs processes.%s.enabled = %s"
                                 % (name, "true" if name in CORE else "false"))

        self.star_mass = real("star.mass_msun", M_SUN)
        self.teff = real("star.teff_k")
        self.l_now = real("star.luminosity_lsun", L_SUN)
        self.t_now = real("star.present_age_yr", YR)
        self.planet_mass = real("planet.mass_mearth", M_EARTH)
        self.radius = real("planet.radius_rearth", R_EARTH)
        self.orbit = real("planet.orbit_au", AU)
        self.ecc = real("planet.eccentricity")
        self.t_exo_ref = real("planet.exobase.reference_temp_k")
        self.t_exo_xuv_exp = real("planet.exobase.xuv_exponent")
        self.t_exo_co2 = real("planet.exobase.co2_cooling")
        self.thermo_base_pa = real("planet.exobase.thermosphere_base_pa")
        self.cross_section = real("planet.exobase.cross_section_m2")
        self.heat_ref_age = real("planet.interior.reference_age_yr", YR)
        self.shares = [real("planet.interior.share_" + n)
                       for n in ("u238", "u235", "th232", "k40")]
        self.water0 = real("inventory.surface_water_to", TO_KG)
        self.mantle_water0 = real("inventory.mantle_water_to", TO_KG)
        self.co2_pa = real("inventory.co2_bar", BAR)
        self.n2_pa = real("inventory.n2_bar", BAR)
        self.o2_pa = real("inventory.o2_bar", BAR)
        self.h2_pa = real("inventory.h2_bar", BAR)
        self.carbonate_pa = real("inventory.carbonate_co2_bar", BAR)
        self.mantle_co2_pa = real("inventory.mantle_co2_bar", BAR)
        self.mantle_n2_pa = real("inventory.mantle_n2_bar", BAR)
        self.dh0 = real("inventory.initial_dh")
        self.albedo = real("climate.bond_albedo")
        self.g0 = real("climate.greenhouse_ref_k")
        self.dt2x = real("climate.co2_doubling_k")
        self.co2_ref_pa = real("climate.co2_reference_bar", BAR)
        self.strat_temperate = real("climate.strat_h2_temperate_ppmv", 1e-6)
        self.freeze_k = real("climate.freeze_temp_k")
        self.dry_kg = real("climate.dry_threshold_to", TO_KG)
        self.runaway_fit = text("climate.runaway_fit")
        self.start = real("run.start_yr", YR)
        self.end = real("run.end_yr", YR)
        self.rtol = real("run.rel_tolerance")
        self.atol_kg = real("run.abs_tolerance_kg")
        self.log_points = int(v["run.log_points"].rstrip("L"))
        self.linear_points = int(v["run.linear_points"].rstrip("L"))
        # processes
        pe = "escape."
        self.eps = real(pe + "xuv_efficiency")
        self.xuv_radius_ratio = real(pe + "xuv_radius_ratio")
        self.homopause_k = real(pe + "homopause_temp_k")
        self.roche = flag(pe + "roche_lobe")
        self.lambda_crit = real(pe + "critical_lambda")
        self.o2_lifetime = real("processes.oxygen_sink.lifetime_myr", 1e6 * YR)
        po = "processes.outgassing."
        tmol = 1e12 / YR
        self.out_co2 = real(po + "co2_tmol_yr", tmol)
        self.out_n2 = real(po + "n2_tmol_yr", tmol)
        self.out_h2o = real(po + "h2o_tmol_yr", tmol)
        self.out_exp = real(po + "heat_flow_exponent")
        self.out_per_mass = flag(po + "scale_by_planet_mass")
        pw = "processes.weathering."
        self.w_ref = real(pw + "reference_rate_tmol_yr", tmol)
        self.w_beta = real(pw + "co2_exponent")
        self.w_te = real(pw + "temp_efold_k")
        self.w_t0 = real(pw + "reference_temp_k")
        self.w_pco2_0 = real(pw + "co2_reference_bar", BAR)
        self.w_land = real(pw + "land_fraction")
        self.w_land_ref = real(pw + "reference_land_fraction")
        self.w_max = real(pw + "supply_limit_tmol_yr", tmol)
        self.w_per_area = flag(pw + "scale_by_surface_area")


# ---------------------------------------------------------------- the model
def pos(v):
    return v if v > 0.0 else 0.0


def ramp_for(r, m_kg, demand):
    """The depletion ramp of src/engine/flux.c."""
    band = max(FLOOR[r], abs(demand) * DRAIN_TIME_S)
    x = m_kg / band
    return 1.0 if x >= 1.0 else (x * (2.0 - x) if x > 0.0 else 2.0 * x)


def psat(t):
    if t < WATER_TTRIPLE_K:
        return math.exp(9.550426 - 5723.265 / t + 3.53068 * math.log(t) - 0.00728332 * t)
    if t <= WATER_TC_K:
        v = 1.0 - t / WATER_TC_K
        rv = math.sqrt(v)
        v3 = v * v * v
        s = (-7.85951783 * v + 1.84408259 * v * rv + -11.7866497 * v3 + 22.6807411 * v3 * rv
             + -15.9618719 * v3 * v + 1.80122502 * v3 * v3 * v * rv)
        return WATER_PC_PA * math.exp(WATER_TC_K / t * s)
    return math.inf


def henry(t):
    return HENRY_298 * math.exp(HENRY_DT_K * (1.0 / t - 1.0 / HENRY_REF_K))


class Ocean:
    """The ocean-atmosphere CO2 split of src/physics/ocean.c."""

    def __init__(self, ocean_m3, t_k, other_kg, other_mol, pa_per_kg):
        c0 = henry(OCEAN_T_REF_K) * PCO2_REF_PA
        self.kh = henry(t_k)
        self.ks = (DIC_REF_MOL_KG * OCEAN_DENSITY - c0) * math.sqrt(self.kh / c0)
        self.ocean_m3 = ocean_m3
        self.other_kg, self.other_mol, self.pa_per_kg = other_kg, other_mol, pa_per_kg

    def atm_mol(self, p_pa):
        mu = MOLAR["CO2"]
        big_p = p_pa / self.pa_per_kg
        b = self.other_kg - big_p
        c = big_p * self.other_mol
        d = math.sqrt(b * b + 4.0 * mu * c)
        return 2.0 * c / (b + d) if b > 0.0 else (d - b) / (2.0 * mu)

    def atm_pa(self, n):
        mu = MOLAR["CO2"]
        return n * (self.other_kg + mu * n) * self.pa_per_kg / (self.other_mol + n)

    def total(self, p_pa):
        return self.atm_mol(p_pa) + self.ocean_m3 * (self.kh * p_pa + self.ks * math.sqrt(p_pa))

    def pool_bound(self, n):
        by_atm = self.atm_pa(n)
        by_gas = n / (self.ocean_m3 * self.kh)
        r = n / (self.ocean_m3 * self.ks)
        return min(by_atm, min(by_gas, r * r))

    def solve_pa(self, n):
        lo, hi = math.log(self.pool_bound(n / 3.0)), math.log(self.pool_bound(n))
        flo, fhi = self.total(math.exp(lo)) - n, self.total(math.exp(hi)) - n
        if flo >= 0.0:
            return math.exp(lo)
        if fhi <= 0.0:
            return math.exp(hi)
        side, it = 0, 0
        while it < 200 and hi - lo > 1e-14 * max(1.0, abs(hi)):
            u = (lo * fhi - hi * flo) / (fhi - flo)
            if not (lo < u < hi):
                u = 0.5 * (lo + hi)
            fu = self.total(math.exp(u)) - n
            if fu < 0.0:
                lo, flo = u, fu
                if side < 0:
                    fhi *= 0.5
                side = -1
            elif fu > 0.0:
                hi, fhi = u, fu
                if side > 0:
                    flo *= 0.5
                side = 1
            else:
                return math.exp(u)
            it += 1
        return math.exp(0.5 * (lo + hi))


def ocean_atm_co2(surface_kg, ocean_m3, t_k, other_kg, other_mol, pa_per_kg):
    if not surface_kg > 0.0:
        return 0.0
    if not ocean_m3 > 0.0:
        return surface_kg
    mu = MOLAR["CO2"]
    o = Ocean(ocean_m3, t_k, other_kg, other_mol, pa_per_kg)
    atm = o.atm_mol(o.solve_pa(surface_kg / mu)) * mu
    return atm if atm < surface_kg else surface_kg


def seff_poly(k, teff):
    t = min(max(teff, 2600.0), 7200.0) - 5780.0
    return k[0] + t * (k[1] + t * (k[2] + t * (k[3] + t * k[4])))


def smaller_weight(a, b):
    if not a > 0.0:
        return 1.0
    if not b > 0.0 or not math.isfinite(a):
        return 0.0
    if not math.isfinite(b):
        return 1.0
    x = 8.0 * (math.log(a) - math.log(b))
    return 0.0 if x > 700.0 else 1.0 / (1.0 + math.exp(x))


def hydro_weight(lam, lam_c):
    u = lam - (lam_c - 0.5)
    u = 0.0 if u < 0.0 else (1.0 if u > 1.0 else u)
    return 1.0 - u * u * (3.0 - 2.0 * u)


class Env:
    __slots__ = ("l_bol", "l_xuv", "inst", "s_eff", "f_xuv", "heat_rel", "mass", "t_surf",
                 "t_balance", "vapour", "ocean", "liquid", "f_strat", "x", "p_pa", "p_surf",
                 "m_background", "t_exo", "r_tb", "n_tb", "r_exo", "g_exo", "lambda_h",
                 "esc_h_flux", "esc_d_frac", "esc_water_share", "s_runaway", "s_moist")


class Core:
    def __init__(self, p):
        self.p = p
        self.g = G_NEWTON * p.planet_mass / (p.radius * p.radius)
        self.area = 4.0 * PI * p.radius * p.radius
        self.pa_per_kg = self.g / self.area
        self.atol = np.array([p.atol_kg * (fl / 1e3) for fl in FLOOR])
        self.calls = 0
        self.max_calls = math.inf
        # parts of the right-hand side that depend on the scenario only
        r_roche = p.orbit * math.cbrt(p.planet_mass / (3.0 * p.star_mass))
        xi = r_roche / (p.xuv_radius_ratio * p.radius)
        k = 1.0 - 1.5 / xi + 0.5 / (xi * xi * xi)
        self.roche_k = (k if k >= 0.01 else 0.01) if p.roche else 1.0
        mm = p.planet_mass / M_EARTH
        m = min(max(mm, K2014_MASS[0]), K2014_MASS[2])
        i = 0 if m <= K2014_MASS[1] else 1
        w = math.log10(m / K2014_MASS[i]) / math.log10(K2014_MASS[i + 1] / K2014_MASS[i])
        s0, s1 = seff_poly(K2014_RUNAWAY[i], p.teff), seff_poly(K2014_RUNAWAY[i + 1], p.teff)
        self.s_runaway = (seff_poly(K2013_RUNAWAY, p.teff) if p.runaway_fit == "k2013"
                          else s0 + w * (s1 - s0))
        self.s_moist = seff_poly(K2013_MOIST, p.teff)

    # -- initial state (vl_model_initial_state)
    def initial_state(self):
        p = self.p
        kg_per_pa = 1.0 / self.pa_per_kg
        y = [0.0] * NRES
        y[R["surface_water"]] = p.water0
        y[R["mantle_water"]] = p.mantle_water0
        y[R["surface_co2"]] = p.co2_pa * kg_per_pa
        y[R["atm_n2"]] = p.n2_pa * kg_per_pa
        y[R["atm_o2"]] = p.o2_pa * kg_per_pa
        y[R["atm_h2"]] = p.h2_pa * kg_per_pa
        y[R["carbonate_rock"]] = p.carbonate_pa * kg_per_pa
        y[R["mantle_carbon"]] = p.mantle_co2_pa * kg_per_pa
        y[R["mantle_nitrogen"]] = p.mantle_n2_pa * kg_per_pa
        for r in range(NRES):
            d = DEUTERIUM.get(r, -1)
            if d >= 0:
                y[d] = y[r] * element_fraction_h(r) * p.dh0 * AW_D / AW_H
        return y

    # -- output ages (output_times in src/engine/integrate.c)
    def output_times(self):
        p = self.p
        t = [p.start]
        for i in range(1, p.log_points + 1):
            t.append(p.start * math.pow(p.end / p.start, i / p.log_points))
        for i in range(1, p.linear_points + 1):
            t.append(p.start + (p.end - p.start) * i / p.linear_points)
        t.append(p.end)
        t.sort()
        u = []
        for v in t:
            v = min(v, p.end)
            if not u or v > u[-1] * (1.0 + 1e-12):
                u.append(v)
        u[-1] = p.end
        return u

    # -- hz_fit climate (hzfit_eval, temperate regime)
    def climate(self, water_kg, e):
        p = self.p
        mass_kg = mol = co2_mol = 0.0
        for g in (GAS_CO2, GAS_N2, GAS_O2, GAS_H2):
            m = e.mass[g] / GAS_MOLAR[g]
            mass_kg += e.mass[g]
            mol += m
            if g == GAS_CO2:
                co2_mol = m
        te = math.pow(e.inst * (1.0 - p.albedo) / (4.0 * SIGMA_SB), 0.25)
        p_dry = mass_kg * self.g / self.area
        pco2 = co2_mol / mol * p_dry if mol > 0.0 else 0.0
        pco2 = max(pco2, 1e-9 * p.co2_ref_pa)
        e.t_balance = te + p.g0 + p.dt2x / math.log(2.0) * math.log(pco2 / p.co2_ref_pa)
        e.t_surf = e.t_balance
        water = max(water_kg, 0.0)
        if e.t_surf >= WATER_TC_K:
            vap = water
        else:
            pp = psat(e.t_surf) * self.area / self.g
            b = mass_kg - pp
            c = pp * mol * MOLAR["H2O"]
            d = math.sqrt(b * b + 4.0 * c)
            mv = 2.0 * c / (b + d) if b > 0.0 else 0.5 * (d - b)
            vap = min(mv, water)
        e.vapour = vap
        e.ocean = water - vap
        e.mass[GAS_H2O] = vap
        e.liquid = 0.0
        if e.t_surf < WATER_TC_K:
            e.liquid = min(1.0, max(0.0, (e.t_surf - p.freeze_k + 10.0) / 10.0))
        e.f_strat = p.strat_temperate

    # -- the environment (vl_model_env) in the temperate regime
    def env(self, t, y):
        p = self.p
        e = Env()
        e.l_bol = p.l_now * (1.0 / (1.0 + 0.4 * (1.0 - t / p.t_now)))
        tau = t / GYR_S
        if tau < 0.1:
            tau = 0.1
        e.l_xuv = 29.7e-3 * math.pow(tau, -1.23) * 4.0 * PI * AU * AU
        orbit = 4.0 * PI * p.orbit * p.orbit * math.sqrt(1.0 - p.ecc * p.ecc)
        e.inst = e.l_bol / orbit
        e.s_eff = e.inst / S_EARTH
        e.f_xuv = e.l_xuv / orbit
        dt = p.heat_ref_age - t
        s = norm = 0.0
        for share, half in zip(p.shares, HALF_LIFE_GYR):
            s += share * math.exp(math.log(2.0) * dt / (half * 1e9 * YR))
            norm += share
        e.heat_rel = s / norm if norm > 0.0 else 1.0
        e.mass = [0.0, pos(y[2]), pos(y[5]), pos(y[8]), pos(y[7])]
        water_y = y[0]
        if water_y > 0.0:  # the temperate ocean holds carbon: split_surface_co2
            surface, water = pos(y[2]), pos(y[0])
            ocean_m3 = water / OCEAN_DENSITY
            other_kg = other_mol = 0.0
            for g, sp in ((GAS_N2, "N2"), (GAS_O2, "O2"), (GAS_H2, "H2")):
                other_kg += e.mass[g]
                other_mol += e.mass[g] / MOLAR[sp]
            e.mass[GAS_CO2] = ocean_atm_co2(surface, ocean_m3, OCEAN_FIRST_PASS_K, other_kg,
                                            other_mol, self.pa_per_kg)
            self.climate(water, e)
            t_ocean = max(e.t_surf, p.freeze_k)
            e.mass[GAS_CO2] = ocean_atm_co2(surface, ocean_m3, t_ocean, other_kg, other_mol,
                                            self.pa_per_kg)
        self.climate(pos(water_y), e)
        # finish_atmosphere
        mol = [0.0] * 5
        mass = moles = bg_mass = bg_mol = 0.0
        for i in range(5):
            mol[i] = e.mass[i] / GAS_MOLAR[i]
            mass += e.mass[i]
            moles += mol[i]
            if i in (GAS_CO2, GAS_N2, GAS_O2):
                bg_mass += e.mass[i]
                bg_mol += mol[i]
        e.p_surf = mass * self.pa_per_kg
        e.x = [m / moles if moles > 0.0 else 0.0 for m in mol]
        e.p_pa = [xi * e.p_surf for xi in e.x]
        m_h2o = MOLAR["H2O"] / AVOGADRO
        e.m_background = bg_mass / bg_mol / AVOGADRO if bg_mol > 0.0 else m_h2o
        # vl_upper_eval: the exobase quantities the Jeans limit reads
        rp = p.radius
        f_xuv_rel = e.f_xuv / F_XUV_EARTH
        t_skin = math.pow(max(e.inst, 0.0) / (8.0 * SIGMA_SB), 0.25)
        t_exo = (p.t_exo_ref * math.pow(max(f_xuv_rel, 0.0), p.t_exo_xuv_exp)
                 / (1.0 + p.t_exo_co2 * e.x[GAS_CO2]))
        e.t_exo = max(t_exo, t_skin)
        m, g = e.m_background, self.g
        t_low = max(t_skin, 1.0)
        p_s = e.p_surf
        z_tb = (K_BOLTZMANN * t_low / (m * g) * math.log(p_s / p.thermo_base_pa)
                if p_s > p.thermo_base_pa else 0.0)
        p_tb = min(p_s, p.thermo_base_pa)
        n_col_tb = p_tb / (m * g)
        h_exo = K_BOLTZMANN * e.t_exo / (m * g)
        z_exo = z_tb + (h_exo * math.log(n_col_tb * p.cross_section)
                        if n_col_tb * p.cross_section > 1.0 else 0.0)
        e.r_tb = rp + z_tb
        e.n_tb = p_tb / (K_BOLTZMANN * t_low)
        e.r_exo = rp + z_exo
        e.g_exo = G_NEWTON * p.planet_mass / (e.r_exo * e.r_exo)
        self.escape(e)
        return e

    # -- the escape stage (src/physics/escape.c) without oxygen drag
    def escape(self, e):
        p = self.p
        m_h, m_d, m_o = AW_H * AMU, AW_D * AMU, AW_O * AMU
        r_xuv = p.xuv_radius_ratio * p.radius
        mdot = (p.eps * PI * r_xuv * r_xuv * p.radius * e.f_xuv
                / (G_NEWTON * p.planet_mass * self.roche_k))
        esc_mass_flux = mdot / self.area
        f_t = e.f_strat + e.x[GAS_H2]
        # diffusion limit
        w = min(max(e.f_strat, 0.0), 1.0)
        tk = p.homopause_k
        m_bg = (1.0 - w) * e.m_background + w * m_o
        m_c = (1.0 - w) * 2.0 * m_h + w * m_h
        b = 1.0 / ((1.0 - w) / (1.89e21 * math.pow(tk / 293.0, 0.75))
                   + w / (4.8e19 * math.pow(tk, 0.75)))
        dm = m_bg - m_c
        # H atoms per particle: f_T diluted by the dissociated water's extra particles
        x_h = 2.0 * f_t / (1.0 + 2.0 * w * f_t)
        diffusion = x_h * b * self.g * dm / (K_BOLTZMANN * tk) if dm > 0.0 else math.inf
        # Jeans limit
        h_h = K_BOLTZMANN * e.t_exo / (m_h * e.g_exo)
        n_h = 2.0 * f_t * e.n_tb * math.exp(-(e.r_exo - e.r_tb) / h_h)
        ratio = e.r_exo / p.radius
        lam = G_NEWTON * p.planet_mass * m_h / (K_BOLTZMANN * e.t_exo * e.r_exo)
        v0 = math.sqrt(2.0 * K_BOLTZMANN * e.t_exo / m_h)
        jeans_flux = (n_h * v0 / (2.0 * math.sqrt(PI)) * (1.0 + lam) * math.exp(-lam))
        esc_h_jeans = ratio * ratio * jeans_flux
        e.lambda_h = lam
        hydro = hydro_weight(lam, p.lambda_crit)
        # vl_upper_h_escape
        h_el = esc_mass_flux / m_h
        jeans = min(esc_h_jeans, h_el)
        cap = (1.0 - hydro) * jeans + hydro * h_el
        e.esc_h_flux = diffusion if diffusion <= cap else cap
        # deuterium fractionation factors and their blend (vl_escape_d_fractionation,
        # f_el = 1): the diffusion factor with carriers HD/H2 (molecular part) and D/H
        # (atomic part), b ~ mu^-1/2 (vl_escape_diffusion_fractionation)
        m_hd = m_h + m_d
        m_cd = (1.0 - w) * m_hd + w * m_d
        if not m_bg > m_cd:
            f_dl = 0.0
        else:
            def b_iso(b_ref, m_ref, m, m_b):
                mu_ref = m_ref * m_b / (m_ref + m_b)
                return b_ref * math.sqrt(mu_ref / (m * m_b / (m + m_b)))
            b_d = 1.0 / ((1.0 - w) / b_iso(1.89e21 * math.pow(tk / 293.0, 0.75), 2.0 * m_h,
                                           m_hd, e.m_background)
                         + w / b_iso(4.8e19 * math.pow(tk, 0.75), m_h, m_d, m_o))
            f_dl = min((b_d / b) * (m_bg - m_cd) / (m_bg - m_c), 1.0)
        # the Jeans factor times the diffusive separation between homopause and exobase
        dr = max(e.r_exo - e.r_tb, 0.0)
        xs = dr * (AW_D - AW_H) * AMU * e.g_exo / (K_BOLTZMANN * e.t_exo)
        sep = math.exp(-xs) if xs > 0.0 else 1.0
        rr = AW_D / AW_H
        ld = lam * rr
        f_jeans = math.sqrt(1.0 / rr) * (1.0 + ld) / (1.0 + lam) * math.exp(lam - ld) * sep
        f_el = 1.0
        s_j = smaller_weight(esc_h_jeans, h_el)
        f_kin = s_j * f_jeans + (1.0 - s_j) * f_el
        f_cap = (1.0 - hydro) * f_kin + hydro * f_el
        s_d = smaller_weight(diffusion, cap)
        e.esc_d_frac = s_d * f_dl + (1.0 - s_d) * f_cap
        e.esc_water_share = e.f_strat / f_t if f_t > 0.0 else 0.0

    # -- flux API (src/engine/flux.c)
    @staticmethod
    def move(y, dydt, frm, to, kg_s, f_d=1.0):
        rate = kg_s * ramp_for(frm, y[frm], kg_s)
        dydt[frm] -= rate
        dydt[to] += rate
        dto, dfrom = DEUTERIUM.get(to, -1), DEUTERIUM.get(frm, -1)
        if dfrom >= 0 and dto >= 0:
            d = Core.deuterium_out(y, frm, rate, f_d)
            dydt[dfrom] -= d
            dydt[dto] += d
        return rate

    @staticmethod
    def deuterium_out(y, frm, rate, f_d):
        d = DEUTERIUM.get(frm, -1)
        if d < 0 or not y[frm] > 0.0:
            return 0.0
        yd = y[d] if y[d] > 0.0 else 0.0
        return f_d * rate / y[frm] * yd

    @staticmethod
    def react(y, dydt, reaction, mol_s, f_d=1.0):
        lim = 1.0
        for res, nu in reaction:
            if nu < 0.0:
                demand = -nu * RES_MOLAR[res] * mol_s
                k = ramp_for(res, y[res], demand)
                if k < lim:
                    lim = k
        rate = mol_s * lim
        d_total = h_products = 0.0
        for res, nu in reaction:
            kg = nu * RES_MOLAR[res] * rate
            dydt[res] += kg
            d = DEUTERIUM.get(res, -1)
            if d < 0:
                continue
            if nu < 0.0:
                out = Core.deuterium_out(y, res, -kg, f_d)
                dydt[d] -= out
                d_total += out
            else:
                h_products += nu * RES_H_ATOMS[res]
        if h_products > 0.0:
            for res, nu in reaction:
                d = DEUTERIUM.get(res, -1)
                if d >= 0 and nu > 0.0:
                    dydt[d] += d_total * nu * RES_H_ATOMS[res] / h_products
        return rate

    KEEP_O2 = ((0, -2.0), (10, 4.0), (8, 1.0))     # 2 H2O -> 4 H(space) + O2
    LOSE_O = ((0, -2.0), (10, 4.0), (13, 2.0))     # 2 H2O -> 4 H(space) + 2 O(space)

    # -- the right-hand side (vl_model_rhs), with the process flux columns
    def rates(self, t, y, cols=None):
        p = self.p
        e = self.env(t, y)
        dydt = [0.0] * NRES
        area = self.area
        # hydrogen_escape: the H2-borne share
        atoms = (1.0 - e.esc_water_share) * e.esc_h_flux * area
        h2 = self.move(y, dydt, 7, 10, atoms * AW_H * 1e-3 / AVOGADRO, e.esc_d_frac)
        # photolysis (o_flux = 0 without escape.oxygen_drag: nothing dragged)
        extent = 0.5 * (e.esc_water_share * e.esc_h_flux * area / (2.0 * AVOGADRO))
        lost = 0.0
        r1 = self.react(y, dydt, self.KEEP_O2, (1.0 - lost) * extent, e.esc_d_frac)
        r2 = self.react(y, dydt, self.LOSE_O, lost * extent, e.esc_d_frac)
        # oxygen_sink
        o2 = y[8] if y[8] > 0.0 else 0.0
        sink = self.move(y, dydt, 8, 9, o2 / p.o2_lifetime)
        # outgassing (mobile lid)
        q = e.heat_rel if e.heat_rel > 0.0 else 0.0
        s = math.pow(q, p.out_exp)
        if p.out_per_mass:
            s *= p.planet_mass / M_EARTH
        oc = self.move(y, dydt, 4, 2, s * p.out_co2 * MOLAR["CO2"])
        on = self.move(y, dydt, 6, 5, s * p.out_n2 * MOLAR["N2"])
        ow = self.move(y, dydt, 1, 0, s * p.out_h2o * MOLAR["H2O"])
        # weathering
        wr = 0.0
        if e.liquid > 0.0:
            pco2 = e.p_pa[GAS_CO2] if e.p_pa[GAS_CO2] > 0.0 else 0.0
            kin0 = -p.w_max * math.log1p(-p.w_ref / p.w_max)
            w = (kin0 * e.liquid * (p.w_land / p.w_land_ref) * math.pow(pco2 / p.w_pco2_0, p.w_beta)
                 * math.exp((e.t_surf - p.w_t0) / p.w_te) * 1.0)
            w = p.w_max * -math.expm1(-w / p.w_max)
            if p.w_per_area:
                w *= area / (4.0 * PI * R_EARTH * R_EARTH)
            wr = self.move(y, dydt, 2, 3, w * MOLAR["CO2"])
        if cols is not None:
            cols.update({"h_escape_from_h2_kg_s": h2,
                         "photolysis_h2o_lost_kg_s": 2.0 * MOLAR["H2O"] * (r1 + r2),
                         "o2_sink_kg_s": sink, "outgas_co2_kg_s": oc, "outgas_n2_kg_s": on,
                         "outgas_h2o_kg_s": ow, "weathering_co2_kg_s": wr,
                         "surface_temp_k": e.t_surf, "p_co2_bar": e.p_pa[GAS_CO2] / BAR,
                         "ocean_co2_kg": pos(pos(y[2]) - e.mass[GAS_CO2]),
                         "exobase_temp_k": e.t_exo, "escape_lambda_h": e.lambda_h})
        return dydt

    def fun(self, t, y):
        self.calls += 1
        if self.calls > self.max_calls:
            raise Stalled(t, self.calls)
        return self.rates(t, y.tolist())

    def jac(self, t, y):
        """volev's Jacobian (jac in src/engine/integrate.c): forward differences with increments
        sqrt(eps) max(|y_j|, floor_j); the space columns, read by no process, are zero."""
        y = y.tolist()
        self.calls += 1
        f0 = self.rates(t, y)
        jm = np.zeros((NRES, NRES))
        for j in range(NRES):
            if R["space_h"] <= j <= R["space_d"]:
                continue
            h = SQRT_EPS * max(abs(y[j]), FLOOR[j])
            yt = list(y)
            yt[j] = y[j] + h
            self.calls += 1
            f1 = self.rates(t, yt)
            for i in range(NRES):
                jm[i, j] = (f1[i] - f0[i]) / h
        return jm

    def classify(self, t, y):
        """The regime the hz_fit rules call for at (t, y), evaluated in the temperate
        regime (hzfit_classify)."""
        e = self.env(t, list(y))
        water = y[0] if y[0] > 0.0 else 0.0
        if water < self.p.dry_kg:
            return 0
        if e.s_eff >= self.s_runaway:
            return 4
        if e.t_balance < self.p.freeze_k:
            return 1
        if e.s_eff >= self.s_moist:
            return 3
        return 2


# ---------------------------------------------------------------- volev's output
def read_series(path):
    """Header names and rows of volev's series.csv (comment lines skipped)."""
    names, rows = None, []
    with open(path, encoding="utf-8") as f:
        for line in f:
            if line.startswith("#"):
                continue
            fields = line.rstrip("\n").split(",")
            if names is None:
                names = fields
            else:
                rows.append([float(v) for v in fields])
    if names is None:
        raise InputError("%s: no header" % path)
    return names, rows


# ---------------------------------------------------------------- runs
JACOBIANS = {"num": "SciPy's own finite differences (num_jac)",
             "fd": "volev's forward differences, passed as jac="}


def solve(core, method, jac, rtol, atol, t_out, first_step, repeat, max_calls):
    """Integrate with solve_ivp; the median wall time of the solve alone over `repeat`
    runs, the counts and the dense solution of the last. A run that exceeds max_calls
    right-hand-side evaluations is abandoned (result "stalled")."""
    y0 = np.array(core.initial_state())
    walls = []
    sol = None
    label = "%s/%s" % (method, jac)
    for _ in range(repeat):
        core.calls = 0
        core.max_calls = max_calls
        t0 = time.perf_counter()
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            try:
                sol = solve_ivp(core.fun, (t_out[0], t_out[-1]), y0, method=method, rtol=rtol,
                                atol=atol, first_step=first_step, dense_output=True,
                                jac=core.jac if jac == "fd" else None)
            except Stalled as exc:
                core.max_calls = math.inf
                return {"label": label, "stalled": str(exc), "wall": time.perf_counter() - t0,
                        "calls": exc.calls, "warnings": len(caught)}
        walls.append(time.perf_counter() - t0)
        core.max_calls = math.inf
        if not sol.success:
            return {"label": label, "stalled": "failed: %s" % sol.message,
                    "wall": walls[-1], "calls": core.calls}
    return {"label": label, "stalled": None, "wall": statistics.median(walls), "walls": walls,
            "steps": len(sol.t) - 1, "calls": core.calls, "nfev": sol.nfev, "njev": sol.njev,
            "nlu": sol.nlu, "sol": sol, "y": sol.sol(np.array(t_out)).T,
            "warnings": len(caught)}


def regime_check(core, res):
    """The first accepted step of a solution whose state the hz_fit rules would not
    call temperate, or None."""
    sol = res["sol"]
    for t, y in zip(sol.t, sol.y.T):
        r = core.classify(t, y)
        if r != TEMPERATE:
            return t, REGIME_NAMES[r]
    return None


def compare(core, a, b, scale_rtol):
    """Per reservoir: the largest relative difference of two trajectories (rows of 23
    masses at the same ages) and the largest difference in units of the local error
    weight atol_i + rtol max(|a|, |b|). The relative difference counts only where a value
    exceeds atol_i."""
    out = []
    for r in range(NRES):
        rel = wtd = 0.0
        nonzero = False
        for ya, yb in zip(a, b):
            va, vb = max(ya[r], 0.0), max(yb[r], 0.0)
            big = max(va, vb)
            d = abs(va - vb)
            if big > 0.0:
                nonzero = True
            if big > core.atol[r]:  # relative differences of trace amounts say nothing
                rel = max(rel, d / big)
            wtd = max(wtd, d / (core.atol[r] + scale_rtol * big))
        out.append((RESERVOIRS[r][0], nonzero, rel, wtd))
    return out


def main(argv):
    ap = argparse.ArgumentParser(description="the core equations of volev with SciPy")
    ap.add_argument("resolved", help="scenario.resolved.cfg written by volev run")
    ap.add_argument("--volev-dir", help="volev's output folder of the same scenario")
    ap.add_argument("--methods", default="BDF,LSODA,Radau")
    ap.add_argument("--jacobians", default="num,fd",
                    help="num (SciPy's num_jac), fd (volev's forward differences)")
    ap.add_argument("--repeat", type=int, default=3)
    ap.add_argument("--max-rhs", type=int, default=100000,
                    help="abandon a solve after this many RHS evaluations (default 100000)")
    ap.add_argument("--reference", action="store_true",
                    help="also a Radau run at rtol and atol / 1e4 as the reference solution")
    ap.add_argument("--factor", type=float, default=1000.0,
                    help="agreement: |difference| <= factor x (atol_i + rtol |y|) at every "
                         "shared output age (default 1000: room for the growth of local "
                         "errors over a whole run; the tables show the measured values)")
    ap.add_argument("--volev-ms", type=float)
    ap.add_argument("--volev-steps", type=int)
    ap.add_argument("--volev-rhs", type=int)
    ap.add_argument("--out", help="write each SciPy trajectory as CSV into this folder")
    try:
        a = ap.parse_args(argv)
    except SystemExit as exc:
        return 2 if exc.code else 0
    if a.repeat < 1 or a.max_rhs < 1 or not a.factor > 0.0:
        sys.stderr.write("core.py: --repeat, --max-rhs and --factor must be positive\n")
        return 2
    methods = [m for m in a.methods.split(",") if m]
    jacs = [j for j in a.jacobians.split(",") if j]
    for m in methods:
        if m not in ("BDF", "LSODA", "Radau"):
            sys.stderr.write("core.py: unknown method %s (BDF, LSODA, Radau)\n" % m)
            return 2
    for j in jacs:
        if j not in JACOBIANS:
            sys.stderr.write("core.py: unknown Jacobian %s (num, fd)\n" % j)
            return 2
    try:
        p = Params(read_resolved(a.resolved))
    except (OSError, InputError, ValueError) as exc:
        sys.stderr.write("core.py: %s\n" % exc)
        return 2
    core = Core(p)
    t_out = core.output_times()
    first = min(1e3 * YR, 1e-3 * (p.end - p.start))
    status = 0

    # the right-hand side against volev's own columns at its output rows
    vrows = None
    if a.volev_dir:
        try:
            names, rows = read_series(os.path.join(a.volev_dir, "series.csv"))
        except (OSError, InputError, ValueError) as exc:
            sys.stderr.write("core.py: %s\n" % exc)
            return 2
        col = {n: i for i, n in enumerate(names)}
        if len(rows) != len(t_out):
            print("volev wrote %d rows, expected %d output ages: an event row? The core must "
                  "stay in one regime." % (len(rows), len(t_out)))
            return 1
        vrows = [[row[col[n + "_kg"]] for (n, _, _) in RESERVOIRS] for row in rows]
        print("Right-hand side: volev's state at its %d output rows (printed to 10 digits) "
              "through core.py, against volev's printed values; largest relative difference:"
              % len(rows))
        keys = ("surface_temp_k", "p_co2_bar", "ocean_co2_kg", "exobase_temp_k",
                "escape_lambda_h", "outgas_co2_kg_s", "outgas_n2_kg_s", "weathering_co2_kg_s",
                "photolysis_h2o_lost_kg_s", "o2_sink_kg_s")
        worst = {k: 0.0 for k in keys}
        for row, y in zip(rows, vrows):
            cols = {}
            core.rates(row[col["time_yr"]] * YR, y, cols)
            for k in keys:
                v, c = row[col[k]], cols[k]
                big = max(abs(v), abs(c))
                if big > 0.0:
                    worst[k] = max(worst[k], abs(v - c) / big)
        for k in keys:
            print("  %-22s %9.2e" % (k, worst[k]))
        rhs_bad = [k for k in keys if worst[k] > 1e-6]
        if rhs_bad:
            print("  MISMATCH (above 1e-6) in: %s" % ", ".join(rhs_bad))
            status = 1
        else:
            print("  all below 1e-6: the same equations (differences come from the 10-digit "
                  "rounding of the printed state)")
        print()

    results = []
    for m in methods:
        for j in jacs:
            results.append(solve(core, m, j, p.rtol, core.atol, t_out, first, a.repeat,
                                 a.max_rhs))
    ref = None
    if a.reference:
        ref = solve(core, "Radau", "fd", p.rtol * 1e-4, core.atol * 1e-4, t_out, first, 1,
                    50 * a.max_rhs)
        ref["label"] = "reference"
        if ref["stalled"]:
            print("reference (Radau, rtol %g): %s" % (p.rtol * 1e-4, ref["stalled"]))
            ref = None
    done = [r for r in results if not r["stalled"]]
    for res in done + ([ref] if ref else []):
        bad = regime_check(core, res)
        if bad:
            print("%s: left the temperate regime at %.6g yr (%s): the core must stay in one "
                  "regime" % (res["label"], bad[0] / YR, bad[1]))
            status = 1
    if a.out:
        os.makedirs(a.out, exist_ok=True)
        for res in done:
            path = os.path.join(a.out, "scipy_%s.csv" % res["label"].replace("/", "_"))
            with open(path, "w", encoding="utf-8") as f:
                f.write("time_yr," + ",".join(n + "_kg" for (n, _, _) in RESERVOIRS) + "\n")
                for t, y in zip(t_out, res["y"]):
                    f.write("%.10g," % (t / YR) + ",".join("%.10g" % v for v in y) + "\n")

    print("Core: %s, %.4g to %.4g yr, rtol %g, atol %g kg x floor/1e3, %d output ages; "
          "SciPy wall time = median of %d solves (solve_ivp only)"
          % (os.path.basename(a.resolved), p.start / YR, p.end / YR, p.rtol, p.atol_kg,
             len(t_out), a.repeat))
    print("Jacobians: num = %s; fd = %s" % (JACOBIANS["num"], JACOBIANS["fd"]))
    print("%-15s %10s %7s %9s %7s %5s %5s %9s %9s" % (
        "solver", "wall_ms", "steps", "rhs_evals", "nfev", "njev", "nlu", "x_time", "x_rhs"))
    have_v = a.volev_ms is not None and a.volev_rhs
    if a.volev_ms is not None:
        print("%-15s %10.2f %7s %9s %7s %5s %5s %9s %9s" % (
            "volev CVODE", a.volev_ms, a.volev_steps if a.volev_steps is not None else "-",
            a.volev_rhs if a.volev_rhs is not None else "-", "-", "-", "-", "1", "1"))
    for res in results + ([ref] if ref else []):
        if res["stalled"]:
            print("%-15s %10.2f  %s" % (res["label"], 1e3 * res["wall"], res["stalled"]))
            continue
        print("%-15s %10.2f %7d %9d %7d %5d %5d %9s %9s" % (
            res["label"], 1e3 * res["wall"], res["steps"], res["calls"], res["nfev"],
            res["njev"], res["nlu"],
            "%.1f" % (1e3 * res["wall"] / a.volev_ms) if have_v and res is not ref else "-",
            "%.2f" % (res["calls"] / a.volev_rhs) if have_v and res is not ref else "-"))
    if ref:
        print("(reference: Radau with the fd Jacobian at rtol %g and atol x 1e-4)" % (p.rtol * 1e-4))
    warned = ["%s %d" % (r["label"], r["warnings"]) for r in results if r["warnings"]]
    if warned:
        print("RuntimeWarnings (overflow in num_jac's step factor) during the solves: %s"
              % ", ".join(warned))
    if done:
        per = ", ".join("%s %.1f" % (r["label"], 1e6 * r["wall"] / r["calls"]) for r in done)
        print("microseconds per RHS evaluation, solver overhead included: %s%s" % (
            per, ", volev %.2f" % (1e3 * a.volev_ms / a.volev_rhs) if have_v else ""))
    print("(rhs_evals: every call of the right-hand side, Jacobian differences included, "
          "as volev counts them; nfev: SciPy's own count, which leaves out num_jac's calls)")
    print()

    # trajectories at the shared output ages
    pairs = []
    if vrows is not None:
        pairs += [("volev", r["label"], vrows, r["y"]) for r in done]
        if ref:
            pairs.append(("volev", "reference", vrows, ref["y"]))
    if ref:
        pairs += [(r["label"], "reference", r["y"], ref["y"]) for r in done]
    if not pairs:
        return status
    table = [compare(core, ya, yb, p.rtol) for _, _, ya, yb in pairs]
    shown = [r for r in range(NRES) if any(t[r][1] for t in table)]
    heads = ["%s-%s" % (x[:5] if x == "volev" else x, "ref" if y == "reference" else y)
             for x, y, _, _ in pairs]
    print("Trajectories at the %d shared output ages (start and end included), per reservoir "
          "(reservoirs zero in every run left out)." % len(t_out))
    print("Largest relative difference |a-b|/max(|a|,|b|):")
    print("%-16s" % "reservoir" + "".join("%16s" % h for h in heads))
    for r in shown:
        print("%-16s" % RESERVOIRS[r][0] + "".join("%16.1e" % t[r][2] for t in table))
    print("Largest difference in local error weights w = atol_i + rtol max(|a|,|b|) "
          "(1 w = what one step may add):")
    print("%-16s" % "reservoir" + "".join("%16s" % h for h in heads))
    for r in shown:
        print("%-16s" % RESERVOIRS[r][0] + "".join("%16.2f" % t[r][3] for t in table))
    print("Verdict (agreement: largest difference within %g w over the run):" % a.factor)
    checked = [i for i, (x, y, _, _) in enumerate(pairs)
               if x == "volev" and (y == "reference" if ref else y.endswith("/fd"))]
    off_ref = {x for (x, y, _, _), t in zip(pairs, table)
               if y == "reference" and x != "volev" and max(row[3] for row in t) > a.factor}
    for i, ((x, y, ya, yb), t) in enumerate(zip(pairs, table)):
        worst = max(row[3] for row in t)
        wr = max(range(NRES), key=lambda r: t[r][3])
        fin = max(abs(ya[-1][r] - yb[-1][r])
                  / (core.atol[r] + p.rtol * max(abs(ya[-1][r]), abs(yb[-1][r])))
                  for r in range(NRES))
        ok = worst <= a.factor
        note = ""
        if x != "volev":
            note = " (SciPy against the reference)"
        elif y in off_ref:
            note = " (%s is itself off the reference)" % y
        print("  %-24s largest %10.2f w (%s), final state %10.2f w: %s%s" % (
            "%s vs %s" % (x, y), worst, RESERVOIRS[wr][0], fin,
            "agree" if ok else "DISAGREE", note))
        if i in checked and not ok:
            status = 1
    return status


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
