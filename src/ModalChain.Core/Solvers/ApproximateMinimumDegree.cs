namespace ModalChain.Core.Solvers;

/// <summary>A fill-reducing elimination order for a symmetric sparse matrix by approximate minimum degree.</summary>
/// <remarks>
/// The elimination is simulated on the quotient graph (George &amp; Liu, 1981, ch. 5): eliminating a pivot p turns it
/// into an element whose variables Lₚ are the union of p's remaining variable neighbours and of the variables of the
/// elements p touched, which are absorbed into p. No clique is ever formed, so the work is close to linear in the
/// size of the graph. The degree of each variable i in Lₚ is not recomputed exactly but bounded from above as in
/// Amestoy, Davis &amp; Duff (1996), An approximate minimum degree ordering algorithm, SIAM J. Matrix Anal. Appl.
/// 17(4), eq. (4): d̄ᵢ = min(n − k, dᵢ + |Lₚ \ i|, |Aᵢ \ i| + |Lₚ \ i| + Σ_{e ∈ Eᵢ, e ≠ p} |Lₑ \ Lₚ|), with the
/// |Lₑ \ Lₚ| found in one pass over the elements next to Lₚ. Elements whose variables all lie in Lₚ are absorbed
/// at once (aggressive absorption). Not implemented from that paper: supervariable detection and mass elimination,
/// which save time on graphs with many indistinguishable nodes but do not change the kind of ordering produced.
/// Ties go to the variable most recently given its degree, so the order is deterministic.
/// </remarks>
internal static class ApproximateMinimumDegree
{
    /// <summary>The order P (new index k → original index) for the graph of a symmetric pattern in compressed rows (the diagonal, if stored, is ignored).</summary>
    public static int[] Order(int n, int[] rowStart, int[] columns)
    {
        var variables = new List<int>[n];     // Aᵢ: variable neighbours, pruned as elements cover them
        var elements = new List<int>[n];      // Eᵢ: elements next to variable i
        var elementVariables = new int[n][];  // Lₑ: variables of element e (indexed by its pivot)
        var state = new byte[n];              // 0 variable, 1 element, 2 absorbed element
        var degree = new int[n];
        for (var i = 0; i < n; i++)
        {
            var list = new List<int>(rowStart[i + 1] - rowStart[i]);
            for (var p = rowStart[i]; p < rowStart[i + 1]; p++)
                if (columns[p] != i) list.Add(columns[p]);
            variables[i] = list;
            elements[i] = [];
            degree[i] = list.Count;
        }

        var queue = new DegreeQueue(n);
        for (var i = 0; i < n; i++) queue.Insert(i, degree[i]);

        var order = new int[n];
        var mark = new int[n];                // stamp: variable is in Lₚ of the current pivot
        var weightStamp = new int[n];
        var weight = new int[n];              // |Lₑ \ Lₚ| for the elements next to Lₚ
        Array.Fill(mark, -1);
        Array.Fill(weightStamp, -1);
        var pivotVariables = new List<int>(64);

        for (var k = 0; k < n; k++)
        {
            var p = queue.PopMinimum();
            order[k] = p;

            // Lₚ = (Aₚ ∪ ⋃ Lₑ over e ∈ Eₚ) \ {p}; every element next to p is absorbed into p.
            pivotVariables.Clear();
            mark[p] = k;
            foreach (var v in variables[p])
                if (state[v] == 0 && mark[v] != k) { mark[v] = k; pivotVariables.Add(v); }
            foreach (var e in elements[p])
            {
                if (state[e] != 1) continue;
                foreach (var v in elementVariables[e])
                    if (state[v] == 0 && mark[v] != k) { mark[v] = k; pivotVariables.Add(v); }
                state[e] = 2;
                elementVariables[e] = [];
            }
            state[p] = 1;
            variables[p] = [];
            elements[p] = [];
            var lp = pivotVariables.ToArray();
            elementVariables[p] = lp;

            // |Lₑ \ Lₚ| for every live element e next to a variable of Lₚ.
            foreach (var i in lp)
                foreach (var e in elements[i])
                {
                    if (state[e] != 1) continue;
                    if (weightStamp[e] != k) { weightStamp[e] = k; weight[e] = elementVariables[e].Length; }
                    weight[e]--;
                }

            var remaining = n - k - 1;
            foreach (var i in lp)
            {
                queue.Remove(i, degree[i]);
                var external = 0;
                var ei = elements[i];
                var kept = 0;
                for (var q = 0; q < ei.Count; q++)
                {
                    var e = ei[q];
                    if (state[e] != 1) continue;
                    if (weight[e] == 0)
                    {
                        // Lₑ ⊆ Lₚ: e adds nothing that p does not already hold.
                        state[e] = 2;
                        elementVariables[e] = [];
                        continue;
                    }
                    external += weight[e];
                    ei[kept++] = e;
                }
                ei.RemoveRange(kept, ei.Count - kept);
                ei.Add(p);

                var ai = variables[i];
                kept = 0;
                for (var q = 0; q < ai.Count; q++)
                {
                    var v = ai[q];
                    if (state[v] != 0 || mark[v] == k) continue;   // eliminated, or covered by element p
                    ai[kept++] = v;
                }
                ai.RemoveRange(kept, ai.Count - kept);

                var bound = Math.Min(remaining, Math.Min(degree[i] + lp.Length - 1, ai.Count + lp.Length - 1 + external));
                degree[i] = Math.Max(bound, 0);
                queue.Insert(i, degree[i]);
            }
        }
        return order;
    }

    /// <summary>Variables bucketed by degree in doubly linked lists, with a moving lower bound on the minimum.</summary>
    private sealed class DegreeQueue
    {
        private readonly int[] _head;
        private readonly int[] _next;
        private readonly int[] _previous;
        private int _minimum;

        public DegreeQueue(int n)
        {
            _head = new int[n + 1];
            _next = new int[n];
            _previous = new int[n];
            Array.Fill(_head, -1);
        }

        public void Insert(int i, int degree)
        {
            _previous[i] = -1;
            _next[i] = _head[degree];
            if (_head[degree] >= 0) _previous[_head[degree]] = i;
            _head[degree] = i;
            if (degree < _minimum) _minimum = degree;
        }

        public void Remove(int i, int degree)
        {
            if (_previous[i] >= 0) _next[_previous[i]] = _next[i];
            else _head[degree] = _next[i];
            if (_next[i] >= 0) _previous[_next[i]] = _previous[i];
        }

        public int PopMinimum()
        {
            while (_head[_minimum] < 0) _minimum++;
            var i = _head[_minimum];
            Remove(i, _minimum);
            return i;
        }
    }
}
