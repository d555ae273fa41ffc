// Internal: dense systems assembled and factored (LU with partial pivoting, Eigen) in storage that each
// thread keeps for its next system.
//
// A design search confirms one new geometry after another, each with systems of a few hundred unknowns. A
// fresh matrix for each, and the factor's copy of it, came as fresh pages from the kernel, and faulting them
// in took two fifths of a turn network's time (BM_TurnNetworkNewGeometry: 10.1 -> 5.9 ms, the figures the same
// to the bit). The storage kept is at most 16 MiB a thread and caller (1448 real unknowns); a larger
// system's is freed after.
#pragma once

#include <cstddef>
#include <vector>

#include <Eigen/Dense>

namespace libcoil::detail {

// An m x m matrix in the storage the calling thread keeps for `Site` (a type of the caller's own, so that
// two callers never share it: the matrix lives until the caller's next call on this thread), or in `once`
// where it is larger. The entries are left as they were.
template <class Scalar, class Site>
Eigen::Map<Eigen::Matrix<Scalar, Eigen::Dynamic, Eigen::Dynamic>> kept_matrix(Eigen::Index m, std::vector<Scalar>& once) {
    thread_local std::vector<Scalar> kept;
    const auto entries = static_cast<std::size_t>(m) * static_cast<std::size_t>(m);
    std::vector<Scalar>& store = entries * sizeof(Scalar) <= (std::size_t{16} << 20) ? kept : once;
    if (store.size() < entries) store.resize(entries);
    return Eigen::Map<Eigen::Matrix<Scalar, Eigen::Dynamic, Eigen::Dynamic>>(store.data(), m, m);
}

// The solution X of A X = rhs, A of m x m written by fill(Eigen::Map<Eigen::MatrixXd>&) (every entry) in
// kept storage and factored there.
template <class Fill>
Eigen::MatrixXd solve_in_place(Eigen::Index m, const Eigen::MatrixXd& rhs, Fill&& fill) {
    std::vector<double> once;
    Eigen::Map<Eigen::MatrixXd> a = kept_matrix<double, Fill>(m, once);
    fill(a);
    return Eigen::PartialPivLU<Eigen::Ref<Eigen::MatrixXd>>(a).solve(rhs);
}

}  // namespace libcoil::detail
