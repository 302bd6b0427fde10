#include "vibtherm/units.hpp"

#include <doctest/doctest.h>

#include "vibtherm/error.hpp"

using namespace vibtherm;

TEST_CASE("wavenumber units") {
  CHECK(*to_wavenumber_cm1(1595.0, "cm^-1") == 1595.0);
  CHECK(*to_wavenumber_cm1(1595.0, "cm-1") == 1595.0);
  CHECK(*to_wavenumber_cm1(1595.0, "1/cm") == 1595.0);
  // 29.9792458 GHz is exactly 1 cm^-1: c = 299792458 m/s (SI definition).
  CHECK(*to_wavenumber_cm1(29.9792458, "GHz") == doctest::Approx(1.0).epsilon(1e-15));
  CHECK(*to_wavenumber_cm1(29979.2458, "MHz") == doctest::Approx(1.0).epsilon(1e-15));
  // 1 eV = 8065.543937 cm^-1 (CODATA 2018 energy conversion table, from memory).
  CHECK(*to_wavenumber_cm1(1000.0, "meV") == doctest::Approx(8065.543937).epsilon(1e-9));
  // 1 K = 0.695034800 cm^-1 (CODATA 2018 energy conversion table, from memory).
  CHECK(*to_wavenumber_cm1(1.0, "K") == doctest::Approx(0.695034800).epsilon(1e-8));
  CHECK_FALSE(to_wavenumber_cm1(1.0, "Hz").has_value());
  CHECK_FALSE(to_wavenumber_cm1(1.0, "CM-1").has_value());
  CHECK_FALSE(to_wavenumber_cm1(1.0, "").has_value());
}

TEST_CASE("molar energy units") {
  CHECK(*to_energy_J_per_mol(-241.826, "kJ/mol") == doctest::Approx(-241826.0));
  CHECK(*to_energy_J_per_mol(1.0, "J/mol") == 1.0);
  CHECK(*to_energy_J_per_mol(1.0, "kcal/mol") == doctest::Approx(4184.0));  // thermochemical calorie, exact
  // 1 eV per particle = e·N_A = 96485.33212331 J/mol (Faraday constant; product of two exact SI 2019 values).
  CHECK(*to_energy_J_per_mol(1.0, "eV") == doctest::Approx(96485.33212331).epsilon(1e-12));
  // 1 hartree = 2625.4996394799 kJ/mol (CODATA 2018, from memory).
  CHECK(*to_energy_J_per_mol(1.0, "hartree") == doctest::Approx(2625499.6394799).epsilon(1e-11));
  CHECK_FALSE(to_energy_J_per_mol(1.0, "kJ").has_value());
  CHECK_FALSE(to_energy_J_per_mol(1.0, "cal").has_value());
}

TEST_CASE("force constant units") {
  // 1 hartree/bohr² = 1556.893 N/m, i.e. 15.569 mdyn/Å (E_h / a0², CODATA 2018; from memory).
  CHECK(*to_force_constant_J_per_m2(1.0, "hartree/bohr^2") == doctest::Approx(1556.893).epsilon(1e-6));
  // 1 kcal/mol/Å² = 4184 J / (6.02214076e23 · 1e-20 m²) = 0.6947695 N/m (exact definitions of
  // the thermochemical calorie, N_A and the ångström, worked out by hand).
  CHECK(*to_force_constant_J_per_m2(1.0, "kcal/mol/A^2") == doctest::Approx(0.6947695).epsilon(1e-6));
  CHECK(*to_force_constant_J_per_m2(4.184, "kJ/mol/A^2") ==
        doctest::Approx(*to_force_constant_J_per_m2(1.0, "kcal/mol/A^2")).epsilon(1e-15));
  CHECK(*to_force_constant_J_per_m2(500.0, "J/m^2") == 500.0);
  CHECK_FALSE(to_force_constant_J_per_m2(1.0, "mdyn/A").has_value());
}

TEST_CASE("unit lists name every unit") {
  CHECK(wavenumber_units_list() == "cm^-1, cm-1, 1/cm, GHz, MHz, meV, K");
  CHECK(energy_units_list() == "kJ/mol, kcal/mol, J/mol, eV, hartree");
  CHECK(pressure_units_list() == "Pa, hPa, kPa, MPa, mbar, bar, atm, Torr");
  CHECK(force_constant_units_list() == "hartree/bohr^2, kcal/mol/A^2, kJ/mol/A^2, J/m^2");
}

TEST_CASE("pressure text") {
  CHECK(*parse_pressure_Pa("1bar") == 1e5);
  CHECK(*parse_pressure_Pa("1 atm") == 101325.0);  // exact by definition
  CHECK(*parse_pressure_Pa("101325Pa") == 101325.0);
  CHECK(*parse_pressure_Pa("100kPa") == doctest::Approx(1e5));
  CHECK(*parse_pressure_Pa("1e5 Pa") == 1e5);
  CHECK(*parse_pressure_Pa("1E+5Pa") == 1e5);
  CHECK(*parse_pressure_Pa("  0.5 MPa ") == doctest::Approx(5e5));
  CHECK(*parse_pressure_Pa("760 Torr") == doctest::Approx(101325.0));  // 1 Torr = 1/760 atm by definition
  CHECK(*parse_pressure_Pa("1013.25 hPa") == doctest::Approx(101325.0));
  CHECK(*parse_pressure_Pa("1000mbar") == doctest::Approx(1e5));
}

TEST_CASE("pressure text that is refused") {
  CHECK_FALSE(parse_pressure_Pa("1").has_value());  // bare numbers are ambiguous
  CHECK_FALSE(parse_pressure_Pa("").has_value());
  CHECK_FALSE(parse_pressure_Pa("bar").has_value());
  CHECK_FALSE(parse_pressure_Pa("-1bar").has_value());
  CHECK_FALSE(parse_pressure_Pa("0 atm").has_value());
  CHECK_FALSE(parse_pressure_Pa("nan bar").has_value());
  CHECK_FALSE(parse_pressure_Pa("inf bar").has_value());
  CHECK_FALSE(parse_pressure_Pa("1e999 bar").has_value());
  CHECK_FALSE(parse_pressure_Pa("1 furlong").has_value());
  CHECK_FALSE(parse_pressure_Pa("1,0 bar").has_value());
  CHECK_FALSE(parse_pressure_Pa("1 BAR").has_value());
}

TEST_CASE("pressure errors say what was wrong") {
  auto message = [](const char* text) {
    try {
      parse_pressure_Pa_or_throw(text);
    } catch (const InputError& e) {
      return std::string(e.what());
    }
    return std::string("no error");
  };
  CHECK(message("-1bar") == "error: pressure '-1bar' must be positive and finite");
  CHECK(message("1") ==
        "error: pressure '1' has no unit, expected one of Pa, hPa, kPa, MPa, mbar, bar, atm, Torr "
        "(a bare number is ambiguous)");
  CHECK(message("2 psi") ==
        "error: unknown pressure unit 'psi' in '2 psi', expected one of Pa, hPa, kPa, MPa, mbar, bar, atm, "
        "Torr");
  CHECK(message("abc") ==
        "error: cannot read pressure 'abc', expected a number and a unit such as 1bar, 1atm, 101325Pa or "
        "100kPa");
  CHECK(parse_pressure_Pa_or_throw("1atm") == 101325.0);
}

TEST_CASE("locale-independent numbers") {
  CHECK(*parse_number("1") == 1.0);
  CHECK(*parse_number("-2.5") == -2.5);
  CHECK(*parse_number("+3e-4") == 3e-4);
  CHECK(*parse_number("1.") == 1.0);
  CHECK(*parse_number(".5") == 0.5);
  CHECK_FALSE(parse_number("").has_value());
  CHECK_FALSE(parse_number("+").has_value());
  CHECK_FALSE(parse_number("+-1").has_value());
  CHECK_FALSE(parse_number("1,5").has_value());
  CHECK_FALSE(parse_number(" 1").has_value());
  CHECK_FALSE(parse_number("1 ").has_value());
  CHECK_FALSE(parse_number("nan").has_value());
  CHECK_FALSE(parse_number("inf").has_value());
  CHECK_FALSE(parse_number("1e400").has_value());
  CHECK_FALSE(parse_number("0x10").has_value());
}
