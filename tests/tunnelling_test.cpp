#include "vibtherm/tunnelling.hpp"

#include <doctest/doctest.h>

#include <cmath>

#include "vibtherm/constants.hpp"

using namespace vibtherm;

TEST_CASE("Wigner correction") {
  // Wigner 1932: κ = 1 + (h c ν̃ / k T)² / 24.
  const double u = 1500.0 * constants::planck_J_s * constants::speed_of_light_m_s * 100.0 /
                   (constants::boltzmann_J_per_K * 300.0);
  CHECK(wigner_kappa(1500.0, 300.0) == doctest::Approx(1.0 + u * u / 24.0).epsilon(1e-14));
  CHECK(wigner_kappa(-1500.0, 300.0) == wigner_kappa(1500.0, 300.0));  // sign of an imaginary input ignored
}

TEST_CASE("Eckart transmission limits") {
  // Exact Eckart transmission (Eckart, Phys. Rev. 35, 1303 (1930)): 0 below the higher
  // asymptote, → 1 far above the top, 1/2 close to the top of a broad (classical-like) barrier.
  const EckartBarrier b{60e3, 90e3, 1200.0};
  CHECK(eckart_transmission(b, -1.0) == 0.0);
  CHECK(eckart_transmission(b, 300e3) == doctest::Approx(1.0).epsilon(1e-9));
  const EckartBarrier endothermic{60e3, 20e3, 1200.0};  // products 40 kJ/mol above the reactants
  CHECK(eckart_transmission(endothermic, 39e3) == 0.0);
  CHECK(eckart_transmission(endothermic, 41e3) > 0.0);
  // A wide barrier (small imaginary wavenumber): P(V1) → 1/2 at the top (common practice, the
  // parabolic-top value 1/(1 + e^0)).
  CHECK(eckart_transmission({60e3, 60e3, 50.0}, 60e3) == doctest::Approx(0.5).epsilon(1e-3));
  // Detailed balance: the same barrier seen from the other side transmits at the same total energy.
  CHECK(eckart_transmission({60e3, 90e3, 1200.0}, 70e3) ==
        doctest::Approx(eckart_transmission({90e3, 60e3, 1200.0}, 100e3)).epsilon(1e-12));
}

TEST_CASE("Eckart kappa tends to 1 at high T and exceeds Wigner at low T") {
  // Johnston & Heicklen, J. Phys. Chem. 66, 532 (1962): κ → 1 as T → ∞; for a thin barrier at
  // low T the full tunnelling integral is larger than the leading-order Wigner term.
  const EckartBarrier thin{50e3, 70e3, 2000.0};
  CHECK(*eckart_kappa(thin, 1e5) == doctest::Approx(1.0).epsilon(1e-3));
  CHECK(std::abs(*eckart_kappa(thin, 1e5) - 1.0) < std::abs(*eckart_kappa(thin, 3000.0) - 1.0));
  for (double T : {200.0, 250.0, 300.0}) CHECK(*eckart_kappa(thin, T) > wigner_kappa(2000.0, T));
  // Deep tunnelling far below any sensible temperature overflows and is reported as absent.
  CHECK_FALSE(eckart_kappa({200e3, 200e3, 3000.0}, 5.0).has_value());
}
