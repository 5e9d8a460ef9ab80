using System.Collections.Immutable;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Dofs;

/// <summary>The map from (node, direction) to matrix index.</summary>
public class DofMapTests
{
    [Fact]
    public void ScalarNetwork_NumbersMassesInDeclarationOrder()
    {
        var network = new NetworkBuilder().AddSupport("wall")
            .AddMass("zeta", 1).AddMass("alpha", 2).AddMass("mid", 3)
            .AddSpring("k", "wall", "mid", 1).Build();
        var map = DofMap.ForScalarNetwork(network);
        Assert.Equal(3, map.Count);
        Assert.Equal(["zeta", "alpha", "mid"], map.Dofs.Select(d => d.Node));
        Assert.All(map.Dofs, d => Assert.Equal(Direction.Along, d.Direction));
        Assert.Equal(0, map.IndexOf("zeta"));
        Assert.Equal(1, map.IndexOf("alpha"));
        Assert.Equal(2, map.IndexOf("mid", Direction.Along));
    }

    [Fact]
    public void Supports_AreNotNumbered()
    {
        var network = new NetworkBuilder().AddSupport("wall").AddMass("m", 1).Build();
        var map = DofMap.ForScalarNetwork(network);
        Assert.Equal(-1, map.IndexOf(Network.Ground));
        Assert.Equal(-1, map.IndexOf("wall"));
        Assert.Equal(-1, map.IndexOf("not-a-node"));
    }

    [Fact]
    public void ScalarDof_PrintsAsItsNodeName()
    {
        Assert.Equal("deck", new Dof("deck", Direction.Along).ToString());
    }

    /// <summary>Links in every arrangement (chains, overlaps, groups joined late, a mass in several links): the DOFs,
    /// their labels, their masses and every index are those of the definition in the class remarks, written here as
    /// grouping by union-find root in index order [identity: the map against a direct statement of its definition].</summary>
    [Fact]
    public void LinkedGroups_MatchTheDefinition_ForRandomLinks()
    {
        var random = new Random(7);
        for (var round = 0; round < 200; round++)
        {
            var n = 2 + random.Next(12);
            var builder = new NetworkBuilder();
            for (var i = 0; i < n; i++) builder.AddMass($"m{i}", 1 + i);
            var links = new List<string[]>();
            for (var l = random.Next(5); l > 0; l--)
            {
                var members = Enumerable.Range(0, n).OrderBy(_ => random.Next()).Take(2 + random.Next(Math.Min(3, n - 1))).Select(i => $"m{i}").ToArray();
                links.Add(members);
                builder.AddLink($"l{links.Count}", members);
            }
            var network = builder.Build();
            var map = DofMap.ForScalarNetwork(network);

            // The definition: masses joined by any chain of links form one group; groups in the order of their first
            // mass; within a group, declaration order; the label joins the names with '+'.
            var parent = Enumerable.Range(0, n).ToArray();
            int Find(int x) => parent[x] == x ? x : parent[x] = Find(parent[x]);
            foreach (var link in links)
                foreach (var name in link.Skip(1))
                {
                    var (a, b) = (Find(int.Parse(link[0][1..])), Find(int.Parse(name[1..])));
                    if (a != b) parent[Math.Max(a, b)] = Math.Min(a, b);
                }
            var groups = Enumerable.Range(0, n).GroupBy(Find).OrderBy(g => g.Min()).Select(g => g.Select(i => $"m{i}").ToImmutableArray()).ToList();

            Assert.Equal(groups.Count, map.Count);
            for (var d = 0; d < groups.Count; d++)
            {
                Assert.True(groups[d].SequenceEqual(map.NodesAt(d)), $"{string.Join(",", groups[d])} vs {string.Join(",", map.NodesAt(d))}; masses {string.Join(",", network.Masses.Select(m => m.Name))}");
                Assert.Equal(string.Join("+", groups[d]), map.Dofs[d].Node);
                Assert.Equal(string.Join("+", groups[d]), map.Label(d));
                foreach (var mass in groups[d]) Assert.Equal(d, map.IndexOf(mass));
            }
            Assert.Equal(-1, map.IndexOf("m0", Direction.X));
            Assert.Equal(-1, map.IndexOf(Network.Ground));
        }
    }
}
