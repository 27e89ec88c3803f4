/* scenario.h: the scenario as plain data (SI) and its libconfig loader.
 * Filled only by the loader; never modified during a run. */
#ifndef VOLEV_SCENARIO_H
#define VOLEV_SCENARIO_H

#include <stdio.h>
#include "volev/magma.h"
#include "volev/params.h"
#include "volev/status.h"

enum vl_lum_model { VL_LUM_SUN_ANALYTIC, VL_LUM_CONSTANT, VL_LUM_TABLE, VL_LUM_CONTRACTING };
#define VL_LUM_CHOICES "sun_analytic|constant|table|contracting"
enum vl_xuv_model { VL_XUV_RATIO, VL_XUV_SOLAR_RIBAS };
#define VL_XUV_CHOICES "ratio|solar_ribas"
enum vl_climate_model { VL_CLIMATE_COLUMN, VL_CLIMATE_HZ_FIT };
#define VL_CLIMATE_CHOICES "column|hz_fit"
enum vl_runaway_fit { VL_RUNAWAY_K2014, VL_RUNAWAY_K2013 };
enum vl_albedo_mode { VL_ALBEDO_COMPUTED, VL_ALBEDO_FIXED };
#define VL_ALBEDO_CHOICES "computed|fixed"
#define VL_RUNAWAY_CHOICES "k2014_mass|k2013"

typedef struct vl_star_params {
    double mass_kg;            /* stellar mass */
    double teff_k;             /* effective temperature (all models but a table with Teff) */
    int luminosity_model;      /* enum vl_lum_model */
    double luminosity_w;       /* constant: L; sun_analytic: L at present_age; contracting: main-sequence L */
    double present_age_s;      /* sun_analytic: age at which L = luminosity_w */
    double contraction_end_s;  /* contracting: arrival on the main sequence */
    char track_file[1024];     /* table: CSV path, resolved against the scenario folder */
    int xuv_model;             /* enum vl_xuv_model */
    double xuv_sat_ratio;      /* ratio: L_XUV/L_bol while saturated */
    double xuv_sat_end_s;      /* ratio: end of saturation */
    double xuv_decay_exp;      /* ratio: beta in (t/t_sat)^-beta */
    double lya_photon_flux;    /* photons m^-2 s^-1 at 1 au for the present Sun; scaled like XUV */
    double wind_mdot_kg_s;     /* stellar wind mass-loss rate at wind_ref_age_s */
    double wind_speed_m_s;     /* wind speed at the planet */
    double wind_ref_age_s;     /* age at which wind_mdot applies */
    double wind_decay_exp;     /* Mdot ~ t^-exp */
} vl_star_params;

typedef struct vl_planet_params {
    double mass_kg;
    double radius_m;
    double orbit_m;            /* semi-major axis */
    double eccentricity;
    double dipole_am2;         /* magnetic dipole moment, A m^2 (0: unmagnetised) */
    double t_exo_ref_k;        /* exobase temperature at present Earth's XUV, CO2-free */
    double t_exo_xuv_exp;      /* T_exo ~ (F_XUV / F_ref)^this */
    double t_exo_co2_cooling;  /* T_exo divided by (1 + this * x_CO2) */
    double thermo_base_pa;     /* pressure of the thermosphere base (homopause), Pa */
    double cross_section_m2;   /* collision cross-section in the exobase criterion, m^2 */
    double obstacle_rp;        /* induced-magnetosphere obstacle, planet radii */
} vl_planet_params;

enum vl_heat_model { VL_HEAT_RADIOGENIC, VL_HEAT_EXPONENTIAL, VL_HEAT_POWER_LAW };
#define VL_HEAT_CHOICES "radiogenic|exponential|power_law"
enum vl_tectonics { VL_TECTONICS_MOBILE, VL_TECTONICS_STAGNANT };
#define VL_TECTONICS_CHOICES "mobile_lid|stagnant_lid"

/* A molten start (docs/model.md section 5b). */
typedef struct vl_magma_ocean_params {
    int molten_start;          /* the run starts with a magma ocean */
    double start_tp_k;         /* mantle potential temperature at the start, K */
    vl_magma_params mantle;    /* what magma.h needs: density, c_p, expansivity, latent
                                  heat, rheological transition, core size */
    double feo_fraction;       /* FeO mass fraction of the silicate */
} vl_magma_ocean_params;

typedef struct vl_interior_params {
    int heat_model;            /* enum vl_heat_model */
    double heat_flow_w;        /* present (reference-age) heat flow, W */
    double ref_age_s;          /* age at which the heat flow has that value */
    double efold_s;            /* exponential: e-folding time */
    double power_exp;          /* power_law: Q ~ (t/t_ref)^-n */
    double share[4];           /* radiogenic: present heat shares of U-238, U-235, Th-232, K-40 */
    int tectonics;             /* enum vl_tectonics */
    vl_magma_ocean_params magma;
} vl_interior_params;

typedef struct vl_inventory_params {
    double surface_water_kg;   /* file: TO */
    double mantle_water_kg;    /* file: TO */
    double co2_pa;             /* file: bar (pressure the gas would exert alone) */
    double n2_pa;
    double o2_pa;
    double h2_pa;
    double carbonate_pa;       /* carbonate rock as CO2-equivalent pressure */
    double mantle_co2_pa;      /* mantle carbon as CO2-equivalent pressure */
    double mantle_n2_pa;       /* mantle nitrogen as N2-equivalent pressure */
    double initial_dh;         /* D/H atom ratio of all hydrogen at the start */
} vl_inventory_params;

typedef struct vl_climate_params {
    int model;                 /* enum vl_climate_model */
    double bond_albedo;
    double greenhouse_ref_k;   /* greenhouse warming at the reference CO2 */
    double co2_doubling_k;     /* equilibrium warming per doubling of pCO2, K */
    double co2_ref_pa;         /* reference CO2 partial pressure (mole fraction x surface pressure), Pa */
    double strat_h2o_temperate;/* stratospheric total-hydrogen mixing ratio, temperate/frozen */
    double strat_h2o_moist;    /* the same in the moist greenhouse */
    double runaway_surface_temp_k; /* surface temperature of the hot steam state */
    double freeze_temp_k;      /* below this mean surface temperature the ocean is frozen */
    double dry_threshold_kg;   /* file: TO; less surface water than this = dry */
    int runaway_fit;           /* enum vl_runaway_fit */
    double moist_threshold;    /* column: stratospheric H2O mixing ratio of the moist greenhouse */
    /* column backend (climate_column.c) */
    double h2o_line_scale;     /* factors on the tabulated absorption (opacity.c) */
    double h2o_nir_line_scale;
    double co2_line_scale;
    double h2o_cont_scale;
    double co2_cont_scale;
    double cia_scale;
    double strat_offset_k;     /* stratosphere = skin temperature - this */
    int albedo_mode;           /* enum vl_albedo_mode */
    double ocean_albedo, land_albedo, land_fraction;
    double ice_albedo_vis, ice_albedo_nir;
    double ice_cover_k;        /* below this T_s the planet is fully ice-covered */
    double ice_free_k;         /* above this T_s it is ice-free */
    double melt_albedo, melt_start_k, melt_full_k;
    double cloud_fraction;     /* share of a wet planet's sky under the cloud layer */
    double cloud_p_ratio;      /* cloud level over the surface pressure */
    double cloud_tau;          /* visible optical depth of the cloud layer */
} vl_climate_params;

/* The escape budget (escape.c): thermal hydrogen escape and the oxygen it drags. */
typedef struct vl_escape_params {
    int thermal;               /* thermal escape of hydrogen on (off: a zero budget) */
    double efficiency;         /* XUV heating efficiency eps */
    double xuv_radius_ratio;   /* R_XUV / R_p */
    double homopause_temp_k;   /* temperature in the diffusion coefficient and scale heights */
    int roche;                 /* apply the Roche-lobe factor K */
    double lambda_crit;        /* hydrodynamic below this escape parameter */
    int cooling;               /* reduce eps by CO2 and H2O cooling */
    double cool_co2;           /* c_CO2 */
    double cool_h2o;           /* c_H2O */
    int drag;                  /* the escaping hydrogen drags oxygen (shares the energy) */
    double drag_temp_k;        /* temperature of the escaping flow in the crossover mass */
} vl_escape_params;

typedef struct vl_run_params {
    double start_s;            /* stellar age at start */
    double end_s;              /* stellar age at end */
    double rel_tol;            /* integrator relative tolerance */
    double abs_tol_kg;         /* integrator absolute tolerance per reservoir */
    long log_points;           /* output rows log-spaced in age */
    long linear_points;        /* output rows linearly spaced in age */
    double event_tol_s;        /* event times located to within this */
    long max_steps;            /* give up after this many accepted steps */
    long max_rhs;              /* ... or right-hand-side evaluations (the work bound) */
    double max_cpu_s;          /* ... or seconds of CPU time (0: no limit) */
} vl_run_params;

/* One process's switch and parameter block (layout owned by the process file). */
typedef struct vl_process_cfg {
    int enabled;
    void *params;              /* owned; size = process->params_size */
} vl_process_cfg;

struct vl_sweep_spec;

#define VL_SCENARIO_WARNINGS 4

typedef struct vl_scenario {
    char path[1024];           /* scenario file as given */
    char name[256];            /* file name without folder and extension */
    int sweep_line;            /* line of a top-level `sweep` group (0 if none) */
    struct vl_sweep_spec *sweep; /* owned; that group as read (sweep_spec.h), NULL if none */
    vl_star_params star;
    vl_planet_params planet;
    vl_interior_params interior;
    vl_inventory_params inventory;
    vl_climate_params climate;
    vl_escape_params escape;
    vl_run_params run;
    vl_process_cfg *proc;      /* owned; one per registered process, registry order */
    unsigned char *origin;     /* owned; enum vl_origin per parameter, global index order */
    int *line;                 /* owned; line in the file per parameter (0 = not in file) */
    double *file_value;        /* owned; REAL parameters: the value in file units as read
                                  (stored SI = file_value * to_si), so the resolved file
                                  shows it as written; global index order */
    int nwarnings;             /* notes on values that load but look wrong (the CLI */
    char warnings[VL_SCENARIO_WARNINGS][320]; /* prints them), e.g. a star off the main sequence */
} vl_scenario;

/* The core parameter table (star, planet, inventory, climate, run); offsets into vl_scenario. */
extern const vl_param vl_core_params[];
extern const size_t vl_core_nparams;

/* Total number of parameters (core + every process's switch and table), and
 * global-index iteration: fills *p, *base (block the offset applies to) and
 * *prefix ("" for core, "processes.<name>." for a process). Switches are
 * reported as a synthetic BOOL parameter "enabled". */
size_t vl_param_count(void);
void vl_param_at(const vl_scenario *sc, size_t i, const vl_param **p, void **base,
                 const char **prefix);

/* Limits of a scenario's text (docs/hardening.md, "Input limits"); the bundled scenarios
 * are under 3 KiB and nest 3 deep. A file beyond them is refused with a message naming
 * the limit, before libconfig sees it. */
#define VL_SCENARIO_SIZE_MAX ((size_t)1 << 20) /* bytes of a scenario (1 MiB) */
#define VL_SCENARIO_DEPTH_MAX 16               /* groups, lists and arrays open at once */
#define VL_SCENARIO_GROUP_MAX 256              /* settings in one group */
#define VL_SCENARIO_LIST_MAX 65536             /* elements of one list or array */

/* 1 if key is the full key of a parameter; else 0 with msg filled ("unknown key 'K'
 * (did you mean ...)" or "'K' is a group, not a parameter"; K a bounded excerpt). */
int vl_scenario_check_key(const char *key, char *msg, size_t n);

/* Allocate a scenario holding every default. Returns NULL on allocation failure. */
vl_scenario *vl_scenario_new(void);
void vl_scenario_free(vl_scenario *sc);

/* Load path into a new scenario; then apply overrides "PATH=VALUE" in order;
 * then cross-check (required keys, needs, consistency). On error returns NULL
 * and fills st with file, line and message. */
vl_scenario *vl_scenario_load(const char *path, const char *const *overrides, size_t n_overrides,
                              vl_status *st);

/* The same checks on scenario text held in memory (len bytes, at most
 * VL_SCENARIO_SIZE_MAX; a NUL or control byte among them is an input error: binary
 * data), without overrides: defaults, the text,
 * the cross-checks. label (NULL: "(text)") stands for the file name in messages and in
 * sc->path / sc->name; relative paths in the text (star.track_file, sweep.catalogue)
 * resolve against the current folder. On error returns NULL and fills st. A top-level
 * `sweep` group is read into sc->sweep as from a file. */
vl_scenario *vl_scenario_parse(const char *text, size_t len, const char *label, vl_status *st);

/* Apply one "PATH=VALUE" override to sc. */
int vl_scenario_override(vl_scenario *sc, const char *assignment, vl_status *st);

/* Write every parameter (after defaults and overrides) as a libconfig scenario that
 * loads back to identical values (reals printed with %.17g). */
int vl_scenario_write_resolved(const vl_scenario *sc, FILE *out, vl_status *st);

/* Print every resolved parameter with unit and origin (the `validate` listing). */
void vl_scenario_print(const vl_scenario *sc, FILE *out);

/* Print every process and the core groups: parameters, units, defaults, bounds, references. */
void vl_params_print_reference(FILE *out);

/* Source audit (docs/sources.md). vl_source_cites: 1 if ref names a paper, handbook,
 * standard or dataset (an author, body or work followed by a year 1900-2029, or a
 * dataset known by name: NSSDC, PREM). vl_source_from_memory: 1 if ref says "from
 * memory" (recalled, not checked against the publication). vl_params_print_sources:
 * the counts and lists of both kinds, as markdown (`volev processes --sources`). */
int vl_source_cites(const char *ref);
int vl_source_from_memory(const char *ref);
void vl_params_print_sources(FILE *out);

#endif
