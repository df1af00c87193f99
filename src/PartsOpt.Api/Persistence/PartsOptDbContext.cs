using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Builds;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Security;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Webhooks;

namespace PartsOpt.Api.Persistence;

/// <summary>
/// The service's database. Schema changes are migrations, created with the local tool from the repo root:
/// <c>dotnet ef migrations add &lt;Name&gt; --project src/PartsOpt.Api --output-dir Persistence/Migrations</c>
/// </summary>
public sealed class PartsOptDbContext(DbContextOptions<PartsOptDbContext> options) : DbContext(options)
{
    public DbSet<Part> Parts => Set<Part>();
    public DbSet<Movement> Movements => Set<Movement>();
    public DbSet<SavedSearch> DesignSearches => Set<SavedSearch>();
    public DbSet<SavedDesign> Designs => Set<SavedDesign>();
    public DbSet<DesignNeed> DesignNeeds => Set<DesignNeed>();
    public DbSet<Build> Builds => Set<Build>();
    public DbSet<BuildLine> BuildLines => Set<BuildLine>();
    public DbSet<OutboxEvent> OutboxEvents => Set<OutboxEvent>();
    public DbSet<Subscription> Subscriptions => Set<Subscription>();
    public DbSet<Delivery> Deliveries => Set<Delivery>();
    public DbSet<DeliveryAttempt> DeliveryAttempts => Set<DeliveryAttempt>();
    public DbSet<ApiKey> ApiKeys => Set<ApiKey>();
    public DbSet<IdempotencyRecord> IdempotencyRecords => Set<IdempotencyRecord>();

    protected override void OnModelCreating(ModelBuilder modelBuilder) =>
        modelBuilder.ApplyConfigurationsFromAssembly(typeof(PartsOptDbContext).Assembly);
}
