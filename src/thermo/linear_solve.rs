//! Small dense linear algebra for the polynomial fits: Gaussian elimination with partial
//! pivoting, and equality-constrained least squares through the Lagrange (KKT) system.

/// Solves `a x = b` for a square `a` (row-major, `n` x `n`); `None` if it is singular.
pub fn solve(mut a: Vec<Vec<f64>>, mut b: Vec<f64>) -> Option<Vec<f64>> {
    let n = b.len();
    if a.len() != n || a.iter().any(|row| row.len() != n) {
        return None;
    }
    let scale = a
        .iter()
        .flat_map(|r| r.iter())
        .fold(0.0f64, |m, v| m.max(v.abs()));
    if scale == 0.0 || !scale.is_finite() {
        return None;
    }
    for col in 0..n {
        let pivot = (col..n).max_by(|&i, &j| a[i][col].abs().total_cmp(&a[j][col].abs()))?;
        if a[pivot][col].abs() <= scale * 1e-15 {
            return None;
        }
        a.swap(col, pivot);
        b.swap(col, pivot);
        let (upper, lower) = a.split_at_mut(col + 1);
        let pivot_row = &upper[col];
        for (offset, row) in lower.iter_mut().enumerate() {
            let f = row[col] / pivot_row[col];
            if f == 0.0 {
                continue;
            }
            for (x, p) in row[col..].iter_mut().zip(&pivot_row[col..]) {
                *x -= f * p;
            }
            b[col + 1 + offset] -= f * b[col];
        }
    }
    let mut x = vec![0.0; n];
    for row in (0..n).rev() {
        let tail: f64 = (row + 1..n).map(|k| a[row][k] * x[k]).sum();
        x[row] = (b[row] - tail) / a[row][row];
    }
    x.iter().all(|v| v.is_finite()).then_some(x)
}

/// One weighted least-squares equation: `sum(row[k] x[k]) ~ target` with weight `weight`.
#[derive(Debug, Clone)]
pub struct Equation {
    /// Coefficients of the unknowns.
    pub row: Vec<f64>,
    /// Right-hand side.
    pub target: f64,
    /// Weight of the squared residual.
    pub weight: f64,
}

/// Minimises `sum w (row x - target)^2` subject to `c x = d` exactly, for `n` unknowns.
/// `None` if the system is singular.
pub fn constrained_least_squares(
    n: usize,
    equations: &[Equation],
    constraints: &[(Vec<f64>, f64)],
) -> Option<Vec<f64>> {
    let m = constraints.len();
    let mut kkt = vec![vec![0.0; n + m]; n + m];
    let mut rhs = vec![0.0; n + m];
    for eq in equations {
        for (i, &ri) in eq.row.iter().enumerate().take(n) {
            let wi = eq.weight * ri;
            if wi == 0.0 {
                continue;
            }
            for (cell, &rj) in kkt[i].iter_mut().zip(eq.row.iter()).take(n) {
                *cell += wi * rj;
            }
            rhs[i] += wi * eq.target;
        }
    }
    for (k, (c, d)) in constraints.iter().enumerate() {
        for (j, &cj) in c.iter().enumerate().take(n) {
            kkt[n + k][j] = cj;
            kkt[j][n + k] = cj;
        }
        rhs[n + k] = *d;
    }
    solve(kkt, rhs).map(|mut x| {
        x.truncate(n);
        x
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn solves_a_small_system() {
        let x = solve(vec![vec![2.0, 1.0], vec![1.0, 3.0]], vec![3.0, 5.0]).unwrap();
        assert!((x[0] - 0.8).abs() < 1e-12 && (x[1] - 1.4).abs() < 1e-12);
        assert!(solve(vec![vec![1.0, 2.0], vec![2.0, 4.0]], vec![1.0, 2.0]).is_none());
    }

    #[test]
    fn constraint_holds_exactly() {
        // Fit y = a + b x to three points with a + b = 10 imposed.
        let eqs: Vec<Equation> = [(0.0, 1.0), (1.0, 3.0), (2.0, 5.0)]
            .iter()
            .map(|&(x, y)| Equation {
                row: vec![1.0, x],
                target: y,
                weight: 1.0,
            })
            .collect();
        let x = constrained_least_squares(2, &eqs, &[(vec![1.0, 1.0], 10.0)]).unwrap();
        assert!((x[0] + x[1] - 10.0).abs() < 1e-12);
    }
}
