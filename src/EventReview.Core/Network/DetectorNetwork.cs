namespace EventReview.Core.Network;

/// <summary>A named set of detector sites. Site codes are unique within a network.</summary>
public sealed class DetectorNetwork
{
    private readonly List<Site> _sites = [];

    private DetectorNetwork()
    {
        Name = string.Empty;
    }

    /// <summary>Creates an empty network.</summary>
    public DetectorNetwork(string name)
    {
        Name = CheckedName(name);
    }

    /// <summary>Database key of the network.</summary>
    public int Id { get; private set; }

    /// <summary>Name of the network: not empty, at most <see cref="Inputs.InputLimits.MaxNameLength"/> characters.</summary>
    public string Name { get; private set; }

    /// <summary>The network's sites; each site code appears once.</summary>
    public IReadOnlyList<Site> Sites => _sites;

    /// <summary>The site with the given code (case-insensitive), or null.</summary>
    public Site? Find(string code) => _sites.FirstOrDefault(s => string.Equals(s.Code, code?.Trim(), StringComparison.OrdinalIgnoreCase));

    /// <summary>Adds a site; refuses a duplicate code.</summary>
    public void Add(Site site)
    {
        if (Find(site.Code) is not null)
        {
            throw new ArgumentException($"Site code {site.Code} is already in network {Name}.", nameof(site));
        }

        _sites.Add(site);
    }

    /// <summary>Removes a site by code; returns false when there is none.</summary>
    public bool Remove(string code)
    {
        var s = Find(code);
        return s is not null && _sites.Remove(s);
    }

    /// <summary>Renames the network; refuses an empty or invalid name (the message says why).</summary>
    public void Rename(string name) => Name = CheckedName(name);

    private static string CheckedName(string name) => string.IsNullOrWhiteSpace(name)
        ? throw new ArgumentException("Network name must not be empty.", nameof(name))
        : Inputs.InputGuard.Identifier(name, Inputs.InputLimits.MaxNameLength, nameof(name));
}
