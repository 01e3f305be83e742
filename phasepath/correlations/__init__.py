"""Published correlations, one function per published equation (SI: K, Pa, J/kg)."""
