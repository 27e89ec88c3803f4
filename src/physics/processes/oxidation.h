/* oxidation.h: what the supply-limited O2 sinks of rock share (crust_oxidation.c,
 * rock_oxidation.c; the laws in oxidation.c): the O2 one kilogram of rock can take up
 * and the saturating dependence on the O2 partial pressure. Private to
 * src/physics/processes. */
#ifndef VOLEV_PROCESSES_OXIDATION_H
#define VOLEV_PROCESSES_OXIDATION_H

/* mol O2 per kg of rock to oxidise share s of its FeO (mass fraction w_feo) to Fe2O3,
 * 4 FeO + O2 -> 2 Fe2O3. */
double vl_oxidation_feo_o2(double w_feo, double s);
/* mol O2 per kg of rock to oxidise its sulfide sulfur (mass fraction w_s) as pyrite to
 * sulfate and ferric hydroxide, FeS2 + 15/4 O2 + 7/2 H2O -> Fe(OH)3 + 2 SO4(2-) + 4 H+:
 * 15/8 O2 per S. */
double vl_oxidation_sulfide_o2(double w_s);
/* Share of the supply taken up at O2 partial pressure p: p / (p + p_half), 0 for p <= 0
 * (saturating: supply-limited at high O2, nothing without O2). */
double vl_oxidation_o2_share(double p_pa, double p_half_pa);

#endif
