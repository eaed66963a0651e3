//! The builder's display units for the `check` and `compare` tables: metric (mm, g, dm^2,
//! g/dm^2) or imperial (in, oz, in^2, oz/ft^2). Speeds stay in m/s (with km/h), angles in
//! degrees. The core computes in SI; only the printing changes.
//!
//! The factors are exact by definition: 1 in = 25.4 mm and 1 oz (avoirdupois) =
//! 28.349523125 g (the international yard and pound, 1959); 1 ft = 12 in.

/// Which units the tables print.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum UnitSystem {
    /// mm, g, dm^2, g/dm^2 (the default, as the aircraft file's defaults).
    #[default]
    Metric,
    /// in, oz, in^2, oz/ft^2.
    Imperial,
}

/// Metres per inch.
const M_PER_IN: f64 = 0.0254;
/// Kilograms per ounce.
const KG_PER_OZ: f64 = 0.028_349_523_125;

impl UnitSystem {
    /// A length given in m, with `mm_decimals` decimals in mm (one more in inches, since an
    /// inch is 25.4 mm).
    pub fn length(self, m: f64, mm_decimals: usize) -> String {
        match self {
            UnitSystem::Metric => super::tables::num(m * 1000.0, mm_decimals),
            UnitSystem::Imperial => super::tables::num(m / M_PER_IN, mm_decimals + 1),
        }
    }

    /// "mm" or "in".
    pub fn length_unit(self) -> &'static str {
        match self {
            UnitSystem::Metric => "mm",
            UnitSystem::Imperial => "in",
        }
    }

    /// A mass given in kg, with `g_decimals` decimals in g (one more in ounces).
    pub fn mass(self, kg: f64, g_decimals: usize) -> String {
        match self {
            UnitSystem::Metric => super::tables::num(kg * 1000.0, g_decimals),
            UnitSystem::Imperial => super::tables::num(kg / KG_PER_OZ, g_decimals + 1),
        }
    }

    /// "g" or "oz".
    pub fn mass_unit(self) -> &'static str {
        match self {
            UnitSystem::Metric => "g",
            UnitSystem::Imperial => "oz",
        }
    }

    /// An area given in m^2 (dm^2 with 2 decimals, or in^2 with 1).
    pub fn area(self, m2: f64) -> String {
        match self {
            UnitSystem::Metric => super::tables::num(m2 * 100.0, 2),
            UnitSystem::Imperial => super::tables::num(m2 / (M_PER_IN * M_PER_IN), 1),
        }
    }

    /// "dm^2" or "in^2".
    pub fn area_unit(self) -> &'static str {
        match self {
            UnitSystem::Metric => "dm^2",
            UnitSystem::Imperial => "in^2",
        }
    }

    /// A wing loading given in kg/m^2 (g/dm^2 or oz/ft^2, 1 decimal... 2 in ounces).
    pub fn loading(self, kg_m2: f64) -> String {
        match self {
            UnitSystem::Metric => super::tables::num(kg_m2 * 10.0, 1),
            UnitSystem::Imperial => {
                let ft = 12.0 * M_PER_IN;
                super::tables::num(kg_m2 * ft * ft / KG_PER_OZ, 2)
            }
        }
    }

    /// A mass moment given in kg m (g*m or oz*in, 2 decimals).
    pub fn moment(self, kg_m: f64) -> String {
        match self {
            UnitSystem::Metric => super::tables::num(kg_m * 1000.0, 2),
            UnitSystem::Imperial => super::tables::num(kg_m / (KG_PER_OZ * M_PER_IN), 2),
        }
    }

    /// A table header or label with its metric unit words replaced (`mm`, `g`, `dm^2`,
    /// `g/dm^2`, `g*m`).
    pub fn header(self, text: &str) -> String {
        if self == UnitSystem::Metric {
            return text.to_string();
        }
        text.split(' ')
            .map(|w| match w {
                "mm" => "in",
                "g" => "oz",
                "dm^2" => "in^2",
                "g/dm^2" => "oz/ft^2",
                "g*m" => "oz*in",
                other => other,
            })
            .collect::<Vec<_>>()
            .join(" ")
    }

    /// A distance along x as "N mm aft of" / "N mm ahead of" (whole mm, or tenths of an inch).
    pub fn aft_or_ahead(self, dx_m: f64) -> String {
        match self {
            UnitSystem::Metric => super::mm_aft_or_ahead(dx_m),
            UnitSystem::Imperial => {
                // Two decimals, as the imperial length columns (one decimal here read 2.5
                // beside a column's 2.55 for the same 64.77 mm).
                let v = dx_m / M_PER_IN;
                let shown = super::tables::num(v.abs(), 2);
                if v < 0.0 && shown != "0.00" {
                    format!("{shown} in ahead of")
                } else {
                    format!("{shown} in aft of")
                }
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // Exact factors: 25.4 mm is 1.00 in, 28.349523125 g is 1.00 oz; 1 kg/m^2 is
    // 0.3048^2 / 0.028349523125 = 3.277 oz/ft^2.
    #[test]
    fn conversions_use_the_exact_definitions() {
        let u = UnitSystem::Imperial;
        assert_eq!(u.length(0.0254, 1), "1.00");
        assert_eq!(u.mass(0.028_349_523_125, 1), "1.00");
        assert_eq!(u.loading(1.0), "3.28");
        assert_eq!(u.header("span mm"), "span in");
        assert_eq!(u.header("mass g"), "mass oz");
        assert_eq!(UnitSystem::Metric.header("span mm"), "span mm");
        assert_eq!(u.aft_or_ahead(-0.0254), "1.00 in ahead of");
        // The same figures as the length column: 64.77 mm is 2.55 in in both.
        assert_eq!(u.length(0.06477, 1), "2.55");
        assert_eq!(u.aft_or_ahead(0.06477), "2.55 in aft of");
    }
}
