//! LU factorisation with partial (row) pivoting of a square matrix, in storage the caller
//! keeps, and the solve with it: after the first use at a size nothing is allocated, for
//! solvers that factor a new matrix at every iteration (Newton's method).
//!
//! Gaussian elimination column by column: the pivot is the first entry of largest magnitude
//! on or below the diagonal, its row is swapped up (the swap recorded), the multipliers below
//! it are the column times the pivot's reciprocal, and each later column is updated by the
//! pivot row times the multipliers. A column with no non-zero entry is left as it is (the
//! solve then reports the zero pivot). The operations and their order are those of
//! nalgebra's `LU`, so the factors and solutions are the same to the bit as `DMatrix::lu`.
//!
//! # References
//! - G. H. Golub, C. F. Van Loan, *Matrix Computations*, 4th ed., Johns Hopkins, 2013,
//!   sec. 3.4 (Gaussian elimination with partial pivoting, PA = LU, and the triangular solves
//!   of sec. 3.1).

use nalgebra::{DMatrix, DVector};

/// The factors L (unit lower, below the diagonal) and U (upper, with the diagonal) of one
/// square matrix in one buffer, with the row swaps made.
#[derive(Debug, Clone, Default)]
pub struct LuWork {
    lu: DMatrix<f64>,
    swaps: Vec<(usize, usize)>,
}

impl LuWork {
    /// Buffers for `n` x `n` matrices.
    pub fn new(n: usize) -> Self {
        LuWork {
            lu: DMatrix::zeros(n, n),
            swaps: Vec::with_capacity(n),
        }
    }

    /// Factor the square matrix `m` (copied; the buffers are resized only when its size
    /// differs from the last one's).
    pub fn factor(&mut self, m: &DMatrix<f64>) {
        let n = m.nrows().min(m.ncols());
        if self.lu.shape() == m.shape() {
            self.lu.copy_from(m);
        } else {
            self.lu = m.clone();
        }
        self.swaps.clear();
        let rows = self.lu.nrows();
        let cols = self.lu.ncols();
        for i in 0..n {
            // Column-major storage: column c is data[c * rows..(c + 1) * rows].
            let data = self.lu.as_mut_slice();
            let mut piv = i;
            let mut largest = data[i * rows + i].abs();
            for (r, v) in data[i * rows + i + 1..(i + 1) * rows].iter().enumerate() {
                if v.abs() > largest {
                    largest = v.abs();
                    piv = i + 1 + r;
                }
            }
            let diag = data[i * rows + piv];
            if diag == 0.0 {
                continue;
            }
            if piv != i {
                self.swaps.push((i, piv));
                self.lu.swap_rows(i, piv);
            }
            let data = self.lu.as_mut_slice();
            let inv_diag = 1.0 / diag;
            for l in &mut data[i * rows + i + 1..(i + 1) * rows] {
                *l *= inv_diag;
            }
            let (head, tail) = data.split_at_mut((i + 1) * rows);
            let multipliers = &head[i * rows + i + 1..];
            for column in tail.chunks_exact_mut(rows).take(cols - i - 1) {
                let p = column[i];
                for (y, l) in column[i + 1..].iter_mut().zip(multipliers) {
                    *y += -p * l;
                }
            }
        }
    }

    /// The diagonal of U.
    pub fn pivots(&self) -> impl Iterator<Item = f64> + '_ {
        let n = self.lu.nrows().min(self.lu.ncols());
        (0..n).map(move |i| self.lu[(i, i)])
    }

    /// Solve `m x = b` for the last matrix factored, in place (`b` becomes `x`); false when a
    /// pivot is zero (`b` is then garbage).
    pub fn solve_in_place(&self, b: &mut DVector<f64>) -> bool {
        let lu = &self.lu;
        let n = lu.nrows();
        if b.len() != n || lu.ncols() != n {
            return false;
        }
        for &(i, j) in &self.swaps {
            b.swap_rows(i, j);
        }
        let data = lu.as_slice();
        let x = b.as_mut_slice();
        for i in 0..n.saturating_sub(1) {
            let coeff = x[i];
            let below = &data[i * n + i + 1..(i + 1) * n];
            for (y, l) in x[i + 1..].iter_mut().zip(below) {
                *y += -coeff * l;
            }
        }
        for i in (0..n).rev() {
            let diag = data[i * n + i];
            if diag == 0.0 {
                return false;
            }
            let coeff = x[i] / diag;
            x[i] = coeff;
            let above = &data[i * n..i * n + i];
            for (y, u) in x[..i].iter_mut().zip(above) {
                *y += -coeff * u;
            }
        }
        true
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A deterministic dense matrix that needs row swaps (small diagonal).
    fn awkward(n: usize) -> DMatrix<f64> {
        DMatrix::from_fn(n, n, |i, j| {
            let x = ((i * 7 + j * 13) % 17) as f64 / 17.0 - 0.5;
            if i == j {
                1e-3 * x
            } else {
                x + 0.1 * (i as f64 - j as f64).sin()
            }
        })
    }

    // Same operations as nalgebra's LU, so the same bits (the claim of the module doc), on
    // matrices needing row swaps, reusing one buffer for several sizes.
    #[test]
    fn same_bits_as_nalgebra() {
        let mut work = LuWork::new(3);
        for n in [1, 2, 5, 24, 24, 9] {
            let m = awkward(n);
            let b = DVector::from_fn(n, |i, _| (i as f64 + 0.5).cos());
            work.factor(&m);
            let mut x = b.clone();
            assert!(work.solve_in_place(&mut x));
            let lu = m.clone().lu();
            let y = lu.solve(&b).unwrap();
            assert!(x
                .iter()
                .zip(y.iter())
                .all(|(a, b)| a.to_bits() == b.to_bits()));
            let u = lu.u();
            assert!(work
                .pivots()
                .zip(u.diagonal().iter())
                .all(|(a, b)| a.to_bits() == b.to_bits()));
        }
    }

    // A system with a known solution: [[0, 2], [3, 1]] x = [4, 5] has x = (1, 2) (by hand;
    // the zero in the corner forces a row swap). Tolerance: round-off.
    #[test]
    fn solves_a_small_system_by_hand() {
        let m = DMatrix::from_row_slice(2, 2, &[0.0, 2.0, 3.0, 1.0]);
        let mut work = LuWork::default();
        work.factor(&m);
        let mut b = DVector::from_vec(vec![4.0, 5.0]);
        assert!(work.solve_in_place(&mut b));
        assert!((b[0] - 1.0).abs() < 1e-15 && (b[1] - 2.0).abs() < 1e-15);
    }

    // A singular matrix (zero column) and a right-hand side of the wrong length are reported,
    // not a panic.
    #[test]
    fn singular_and_mismatched_are_refused() {
        let m = DMatrix::from_row_slice(2, 2, &[1.0, 0.0, 2.0, 0.0]);
        let mut work = LuWork::default();
        work.factor(&m);
        assert!(!work.solve_in_place(&mut DVector::from_vec(vec![1.0, 1.0])));
        assert!(!work.solve_in_place(&mut DVector::from_vec(vec![1.0, 1.0, 1.0])));
    }
}
