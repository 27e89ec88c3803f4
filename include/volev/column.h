/* column.h: a one-dimensional radiative column: temperature profile from the surface
 * (dry adiabat, or the non-dilute moist pseudo-adiabat over an ocean) up to an
 * isothermal stratosphere, and grey two-stream longwave transfer through it.
 * Equations and calibration: docs/model.md, "Radiative column". */
#ifndef VOLEV_COLUMN_H
#define VOLEV_COLUMN_H

typedef struct vl_column_opts {
    double g;              /* surface gravity, m/s^2 */
    double k_h2o;          /* grey mass absorption coefficient of H2O at p0, m^2/kg */
    double k_co2;          /* grey mass absorption coefficient of CO2 at p0, m^2/kg */
    double p0;             /* pressure-broadening reference pressure, Pa */
    double n_h2o;          /* broadening exponent of H2O: opacity ~ (p/p0)^n */
    double n_co2;          /* broadening exponent of CO2 */
    double u_co2_sat;      /* CO2 column (kg/m^2) above which its band saturates (log law) */
    double k_cia;          /* CO2-CO2 collision-induced absorption at p0, m^2/kg per unit q_co2 */
    double strat_offset_k; /* stratosphere temperature = skin temperature - this, K */
    int wet;               /* 1: saturated over an ocean; 0: no water in the column */
} vl_column_opts;

typedef struct vl_column_air {
    double p_dry_pa;       /* surface pressure of the non-condensing gases, Pa */
    double m_dry;          /* their mean molar mass, kg/mol */
    double cp_dry;         /* their specific heat, J kg^-1 K^-1 */
    double q_co2;          /* CO2 mass fraction of the non-condensing gases */
} vl_column_air;

typedef struct vl_column_out {
    double olr;            /* outgoing longwave radiation, W/m^2 */
    double t_strat;        /* stratosphere (and tropopause) temperature, K */
    double p_trop;         /* tropopause pressure, Pa */
    double p_surf;         /* surface pressure including vapour, Pa */
    double f_strat;        /* H2O mole fraction above the cold trap */
    double tau;            /* longwave optical depth of the whole column */
} vl_column_out;

/* Diffusivity factor of the two-stream approximation (Elsasser 1942; common practice). */
#define VL_COLUMN_DIFFUSIVITY 1.66

/* Specific heat at constant pressure near 300 K, J kg^-1 K^-1 (NIST-JANAF tables,
 * from memory): N2 1040, O2 918, CO2 846, H2 14310. */
#define VL_CP_N2 1040.0
#define VL_CP_O2 918.0
#define VL_CP_CO2 846.0
#define VL_CP_H2 14310.0

/* The column at surface temperature t_s: profile, OLR, cold trap. The stratosphere
 * sits at the skin temperature (OLR / 2 sigma)^(1/4) less strat_offset_k, found by
 * fixed-point iteration from olr_guess (W/m^2; <= 0 for a default). */
void vl_column_eval(const vl_column_opts *o, const vl_column_air *air, double t_s,
                    double olr_guess, vl_column_out *out);

/* The same with the stratosphere temperature given (no iteration). */
void vl_column_eval_fixed(const vl_column_opts *o, const vl_column_air *air, double t_s,
                          double t_strat, vl_column_out *out);

#endif
