/* redox.h: the redox state of volcanic gases: oxygen fugacity of the fayalite-magnetite-
 * quartz (FMQ) and iron-wustite (IW) buffers, the equilibrium constants of H2 + 1/2 O2 =
 * H2O and CO + 1/2 O2 = CO2, and the H2/H2O and CO/CO2 ratios of a gas at a given oxygen
 * fugacity. Pure functions, no state. Units as the names say: temperature in K,
 * pressure and fugacity in bar (standard state 1 bar), logarithms base 10. Ideal gases;
 * valid 1000-2000 K (the buffers' fits are extrapolated above ~1500 K). Equations,
 * sources and what is left out: docs/model.md section 4 (volcanic_reductants).
 *
 * Invalid input (any argument non-finite, t_k <= 0, p_bar < 0) gives NAN, never a
 * partial number; vl_redox_volcanic_ratios writes NAN to both outputs then. */
#ifndef VOLEV_REDOX_H
#define VOLEV_REDOX_H

/* log10 fO2 (bar) of the FMQ buffer, 3 Fe2SiO4 + O2 = 2 Fe3O4 + 3 SiO2, at t_k and a
 * pressure p_bar on the solids: -25096.3/T + 8.735 + 0.110 (P - 1)/T (Frost 1991, Rev.
 * Mineral. 25:1, table 1, beta-quartz field; from memory). -8.30 at 1473.15 K, 1 bar. */
double vl_redox_log_fo2_fmq(double t_k, double p_bar);

/* log10 fO2 (bar) of the IW buffer, 2 Fe + O2 = 2 FeO, at t_k and p_bar:
 * -27489/T + 6.702 + 0.055 (P - 1)/T (Frost 1991, table 1; from memory). About 3.5-3.9
 * log units below FMQ at 1000-1300 degC. */
double vl_redox_log_fo2_iw(double t_k, double p_bar);

/* log10 K (1 bar standard state) of H2 + 1/2 O2 = H2O(g) at t_k: -dG/(R T ln 10) with dG
 * the Gibbs energy of formation of H2O(g), NIST-JANAF (Chase 1998) at 1000, 1500 and
 * 2000 K, joined by a + b T + c T ln T (constant heat capacity of reaction). 5.72 at
 * 1500 K. */
double vl_redox_log_k_h2o(double t_k);

/* log10 K (1 bar standard state) of CO + 1/2 O2 = CO2 at t_k: the same construction from
 * dG(CO2) - dG(CO) of NIST-JANAF (Chase 1998). 5.31 at 1500 K. */
double vl_redox_log_k_co2(double t_k);

/* Molar ratio H2/H2O of an ideal gas in equilibrium at t_k and log10 fO2 (bar):
 * 1 / (K_H2O fO2^1/2); it does not depend on the total pressure. */
double vl_redox_h2_per_h2o(double t_k, double log_fo2);

/* Molar ratio CO/CO2 of an ideal gas in equilibrium at t_k and log10 fO2 (bar):
 * 1 / (K_CO2 fO2^1/2). */
double vl_redox_co_per_co2(double t_k, double log_fo2);

/* log10 fO2 (bar) of an ideal gas at t_k whose H2/H2O molar ratio is h2_per_h2o (> 0; 0,
 * negative or non-finite gives NAN): the inverse of vl_redox_h2_per_h2o. */
double vl_redox_log_fo2_of_h2_per_h2o(double t_k, double h2_per_h2o);

/* The H2/H2O and CO/CO2 molar ratios of gas leaving a magma at t_k and p_bar whose fO2 is
 * delta_fmq log units above the FMQ buffer (negative: more reduced). Either output
 * pointer may be NULL (not written). */
void vl_redox_volcanic_ratios(double t_k, double p_bar, double delta_fmq, double *h2_per_h2o,
                              double *co_per_co2);

#endif
