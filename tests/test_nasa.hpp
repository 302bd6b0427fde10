// A published NASA-7 record for tests: O2 as distributed with GRI-Mech 3.0 (source code
// TPIS89; tests/data/o2_gri30_from_memory.dat; coefficients from memory).
#pragma once

#include "vibtherm/nasa.hpp"

namespace vibtherm::test {

inline Nasa7 o2_gri30_record() {
  Nasa7 n;
  n.name = "O2";
  n.note = "TPIS89";
  n.composition = {{"O", 2}};
  n.T_low_K = 200.0;
  n.T_mid_K = 1000.0;
  n.T_high_K = 3500.0;
  n.high = {3.28253784E+00,  1.48308754E-03,  -7.57966669E-07, 2.09470555E-10,
            -2.16717794E-14, -1.08845772E+03, 5.45323129E+00};
  n.low = {3.78245636E+00, -2.99673416E-03, 9.84730201E-06, -9.68129509E-09,
           3.24372837E-12, -1.06394356E+03, 3.65767573E+00};
  return n;
}

}  // namespace vibtherm::test
