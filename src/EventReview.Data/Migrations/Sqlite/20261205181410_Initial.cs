using System;
using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace EventReview.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class Initial : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "AccountEvents",
                columns: table => new
                {
                    Id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Sequence = table.Column<long>(type: "INTEGER", nullable: false),
                    At = table.Column<long>(type: "INTEGER", nullable: false),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    UserId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    Account = table.Column<string>(type: "TEXT", maxLength: 120, nullable: false),
                    Address = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Detail = table.Column<string>(type: "TEXT", maxLength: 300, nullable: false),
                    PreviousHash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Hash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Facts = table.Column<string>(type: "TEXT", nullable: true),
                    KeyId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    Mac = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_AccountEvents", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "ApiTokens",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Name = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    Hash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Role = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    CreatedBy = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    CreatedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    LastUsedAt = table.Column<long>(type: "INTEGER", nullable: true),
                    RevokedAt = table.Column<long>(type: "INTEGER", nullable: true),
                    Scopes = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    ExpiresAt = table.Column<long>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_ApiTokens", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "AspNetRoles",
                columns: table => new
                {
                    Id = table.Column<string>(type: "TEXT", nullable: false),
                    Name = table.Column<string>(type: "TEXT", maxLength: 256, nullable: true),
                    NormalizedName = table.Column<string>(type: "TEXT", maxLength: 256, nullable: true),
                    ConcurrencyStamp = table.Column<string>(type: "TEXT", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_AspNetRoles", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "AspNetUsers",
                columns: table => new
                {
                    Id = table.Column<string>(type: "TEXT", nullable: false),
                    DisplayName = table.Column<string>(type: "TEXT", nullable: false),
                    UserName = table.Column<string>(type: "TEXT", maxLength: 256, nullable: true),
                    NormalizedUserName = table.Column<string>(type: "TEXT", maxLength: 256, nullable: true),
                    Email = table.Column<string>(type: "TEXT", maxLength: 256, nullable: true),
                    NormalizedEmail = table.Column<string>(type: "TEXT", maxLength: 256, nullable: true),
                    EmailConfirmed = table.Column<bool>(type: "INTEGER", nullable: false),
                    PasswordHash = table.Column<string>(type: "TEXT", nullable: true),
                    SecurityStamp = table.Column<string>(type: "TEXT", nullable: true),
                    ConcurrencyStamp = table.Column<string>(type: "TEXT", nullable: true),
                    PhoneNumber = table.Column<string>(type: "TEXT", nullable: true),
                    PhoneNumberConfirmed = table.Column<bool>(type: "INTEGER", nullable: false),
                    TwoFactorEnabled = table.Column<bool>(type: "INTEGER", nullable: false),
                    LockoutEnd = table.Column<long>(type: "INTEGER", nullable: true),
                    LockoutEnabled = table.Column<bool>(type: "INTEGER", nullable: false),
                    AccessFailedCount = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_AspNetUsers", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "Cases",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    CandidateId = table.Column<string>(type: "TEXT", maxLength: 128, nullable: false),
                    GpsNanoseconds = table.Column<long>(type: "INTEGER", nullable: false),
                    Search = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    Summary = table.Column<string>(type: "TEXT", maxLength: 20000, nullable: false),
                    State = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    Outcome = table.Column<string>(type: "TEXT", maxLength: 32, nullable: true),
                    ClosingStatement = table.Column<string>(type: "TEXT", nullable: true),
                    CoordinatorId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    CoordinatorName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    ChecklistName = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    ChecklistVersion = table.Column<int>(type: "INTEGER", nullable: false),
                    CreatedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    UpdatedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    Version = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Cases", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "DataProtectionKeys",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    FriendlyName = table.Column<string>(type: "TEXT", nullable: true),
                    Xml = table.Column<string>(type: "TEXT", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_DataProtectionKeys", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "Networks",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Name = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Networks", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "NotificationCursors",
                columns: table => new
                {
                    Name = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    Position = table.Column<long>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_NotificationCursors", x => x.Name);
                });

            migrationBuilder.CreateTable(
                name: "Notifications",
                columns: table => new
                {
                    Id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    UserId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    CaseId = table.Column<int>(type: "INTEGER", nullable: true),
                    ItemKey = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    Subject = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    Text = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: false),
                    Link = table.Column<string>(type: "TEXT", maxLength: 300, nullable: false),
                    CreatedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    DedupKey = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    RoutedAt = table.Column<long>(type: "INTEGER", nullable: true),
                    Route = table.Column<string>(type: "TEXT", maxLength: 32, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Notifications", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "NotificationSettings",
                columns: table => new
                {
                    UserId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Events = table.Column<int>(type: "INTEGER", nullable: false),
                    ByEmail = table.Column<bool>(type: "INTEGER", nullable: false),
                    WebhookUrl = table.Column<string>(type: "TEXT", maxLength: 500, nullable: true),
                    WebhookSecret = table.Column<string>(type: "TEXT", maxLength: 100, nullable: true),
                    Digest = table.Column<bool>(type: "INTEGER", nullable: false),
                    UpdatedAt = table.Column<long>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_NotificationSettings", x => x.UserId);
                });

            migrationBuilder.CreateTable(
                name: "OutboxMessages",
                columns: table => new
                {
                    Id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    UserId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Channel = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    Target = table.Column<string>(type: "TEXT", maxLength: 500, nullable: false),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    Subject = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    Body = table.Column<string>(type: "TEXT", nullable: false),
                    CreatedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    Attempts = table.Column<int>(type: "INTEGER", nullable: false),
                    NextAttemptAt = table.Column<long>(type: "INTEGER", nullable: false),
                    ClaimedUntil = table.Column<long>(type: "INTEGER", nullable: true),
                    SentAt = table.Column<long>(type: "INTEGER", nullable: true),
                    GaveUpAt = table.Column<long>(type: "INTEGER", nullable: true),
                    LastError = table.Column<string>(type: "TEXT", maxLength: 500, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_OutboxMessages", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "SealedInjectionRecords",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Commitment = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Label = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    SealedById = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    SealedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    SealedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    OpenedById = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    OpenedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    OpenedAt = table.Column<long>(type: "INTEGER", nullable: true),
                    OpenedInCaseId = table.Column<int>(type: "INTEGER", nullable: true),
                    OpenedSummary = table.Column<string>(type: "TEXT", maxLength: 1000, nullable: true),
                    OpenedRecord = table.Column<byte[]>(type: "BLOB", nullable: true),
                    OpenedSalt = table.Column<string>(type: "TEXT", maxLength: 256, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_SealedInjectionRecords", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "SignatureRequests",
                columns: table => new
                {
                    Id = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    UserId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    CaseId = table.Column<int>(type: "INTEGER", nullable: false),
                    ItemKey = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Meaning = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    Statement = table.Column<string>(type: "TEXT", maxLength: 4000, nullable: false),
                    SeenFingerprint = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    CreatedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    UsedAt = table.Column<long>(type: "INTEGER", nullable: true),
                    Signed = table.Column<bool>(type: "INTEGER", nullable: false),
                    Outcome = table.Column<string>(type: "TEXT", maxLength: 500, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_SignatureRequests", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "AspNetRoleClaims",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    RoleId = table.Column<string>(type: "TEXT", nullable: false),
                    ClaimType = table.Column<string>(type: "TEXT", nullable: true),
                    ClaimValue = table.Column<string>(type: "TEXT", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_AspNetRoleClaims", x => x.Id);
                    table.ForeignKey(
                        name: "FK_AspNetRoleClaims_AspNetRoles_RoleId",
                        column: x => x.RoleId,
                        principalTable: "AspNetRoles",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "AspNetUserClaims",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    UserId = table.Column<string>(type: "TEXT", nullable: false),
                    ClaimType = table.Column<string>(type: "TEXT", nullable: true),
                    ClaimValue = table.Column<string>(type: "TEXT", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_AspNetUserClaims", x => x.Id);
                    table.ForeignKey(
                        name: "FK_AspNetUserClaims_AspNetUsers_UserId",
                        column: x => x.UserId,
                        principalTable: "AspNetUsers",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "AspNetUserLogins",
                columns: table => new
                {
                    LoginProvider = table.Column<string>(type: "TEXT", nullable: false),
                    ProviderKey = table.Column<string>(type: "TEXT", nullable: false),
                    ProviderDisplayName = table.Column<string>(type: "TEXT", nullable: true),
                    UserId = table.Column<string>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_AspNetUserLogins", x => new { x.LoginProvider, x.ProviderKey });
                    table.ForeignKey(
                        name: "FK_AspNetUserLogins_AspNetUsers_UserId",
                        column: x => x.UserId,
                        principalTable: "AspNetUsers",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "AspNetUserRoles",
                columns: table => new
                {
                    UserId = table.Column<string>(type: "TEXT", nullable: false),
                    RoleId = table.Column<string>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_AspNetUserRoles", x => new { x.UserId, x.RoleId });
                    table.ForeignKey(
                        name: "FK_AspNetUserRoles_AspNetRoles_RoleId",
                        column: x => x.RoleId,
                        principalTable: "AspNetRoles",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                    table.ForeignKey(
                        name: "FK_AspNetUserRoles_AspNetUsers_UserId",
                        column: x => x.UserId,
                        principalTable: "AspNetUsers",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "AspNetUserTokens",
                columns: table => new
                {
                    UserId = table.Column<string>(type: "TEXT", nullable: false),
                    LoginProvider = table.Column<string>(type: "TEXT", nullable: false),
                    Name = table.Column<string>(type: "TEXT", nullable: false),
                    Value = table.Column<string>(type: "TEXT", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_AspNetUserTokens", x => new { x.UserId, x.LoginProvider, x.Name });
                    table.ForeignKey(
                        name: "FK_AspNetUserTokens_AspNetUsers_UserId",
                        column: x => x.UserId,
                        principalTable: "AspNetUsers",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "CaseArrivals",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    SiteCode = table.Column<string>(type: "TEXT", maxLength: 8, nullable: false),
                    ArrivalNanoseconds = table.Column<long>(type: "INTEGER", nullable: false),
                    Snr = table.Column<double>(type: "REAL", nullable: false),
                    ReviewCaseId = table.Column<int>(type: "INTEGER", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_CaseArrivals", x => x.Id);
                    table.ForeignKey(
                        name: "FK_CaseArrivals_Cases_ReviewCaseId",
                        column: x => x.ReviewCaseId,
                        principalTable: "Cases",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "ChecklistItems",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ReviewCaseId = table.Column<int>(type: "INTEGER", nullable: false),
                    Key = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    SectionKey = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    SectionTitle = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    SectionOrder = table.Column<int>(type: "INTEGER", nullable: false),
                    Order = table.Column<int>(type: "INTEGER", nullable: false),
                    Title = table.Column<string>(type: "TEXT", maxLength: 300, nullable: false),
                    Guidance = table.Column<string>(type: "TEXT", nullable: false),
                    CheckKind = table.Column<string>(type: "TEXT", maxLength: 32, nullable: true),
                    OwnerId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    OwnerName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    DueDate = table.Column<DateOnly>(type: "TEXT", nullable: true),
                    State = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    RequiredSignOffs = table.Column<int>(type: "INTEGER", nullable: false),
                    OwnerMaySign = table.Column<bool>(type: "INTEGER", nullable: false),
                    Version = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_ChecklistItems", x => x.Id);
                    table.ForeignKey(
                        name: "FK_ChecklistItems_Cases_ReviewCaseId",
                        column: x => x.ReviewCaseId,
                        principalTable: "Cases",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "ConfigurationSnapshots",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ReviewCaseId = table.Column<int>(type: "INTEGER", nullable: true),
                    SiteCode = table.Column<string>(type: "TEXT", maxLength: 8, nullable: false),
                    Label = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    CapturedBy = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    CapturedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    CapturedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    ItemsJson = table.Column<string>(type: "TEXT", nullable: false),
                    IsFrozen = table.Column<bool>(type: "INTEGER", nullable: false),
                    FrozenBy = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    FrozenByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    FrozenAt = table.Column<long>(type: "INTEGER", nullable: true),
                    FreezeFrom = table.Column<long>(type: "INTEGER", nullable: true),
                    FreezeUntil = table.Column<long>(type: "INTEGER", nullable: true),
                    FreezeReason = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: true),
                    Fingerprint = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_ConfigurationSnapshots", x => x.Id);
                    table.ForeignKey(
                        name: "FK_ConfigurationSnapshots_Cases_ReviewCaseId",
                        column: x => x.ReviewCaseId,
                        principalTable: "Cases",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "DossierExports",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ReviewCaseId = table.Column<int>(type: "INTEGER", nullable: false),
                    ManifestSha256 = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    ChainHead = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    SizeBytes = table.Column<long>(type: "INTEGER", nullable: false),
                    ExportedBy = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    ExportedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    ExportedAt = table.Column<long>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_DossierExports", x => x.Id);
                    table.ForeignKey(
                        name: "FK_DossierExports_Cases_ReviewCaseId",
                        column: x => x.ReviewCaseId,
                        principalTable: "Cases",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "Timeline",
                columns: table => new
                {
                    Id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ReviewCaseId = table.Column<int>(type: "INTEGER", nullable: false),
                    CandidateId = table.Column<string>(type: "TEXT", maxLength: 128, nullable: false),
                    Sequence = table.Column<int>(type: "INTEGER", nullable: false),
                    At = table.Column<long>(type: "INTEGER", nullable: false),
                    ActorId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    ActorName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    ItemKey = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    Text = table.Column<string>(type: "TEXT", nullable: false),
                    PreviousHash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Hash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Facts = table.Column<string>(type: "TEXT", nullable: true),
                    KeyId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    Mac = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Timeline", x => x.Id);
                    table.ForeignKey(
                        name: "FK_Timeline_Cases_ReviewCaseId",
                        column: x => x.ReviewCaseId,
                        principalTable: "Cases",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "Sites",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Code = table.Column<string>(type: "TEXT", maxLength: 8, nullable: false),
                    Name = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    LatitudeDegrees = table.Column<double>(type: "REAL", nullable: false),
                    LongitudeDegrees = table.Column<double>(type: "REAL", nullable: false),
                    HeightMeters = table.Column<double>(type: "REAL", nullable: false),
                    XArmAzimuthDegrees = table.Column<double>(type: "REAL", nullable: false),
                    YArmAzimuthDegrees = table.Column<double>(type: "REAL", nullable: false),
                    TimingUncertaintySeconds = table.Column<double>(type: "REAL", nullable: false),
                    NetworkId = table.Column<int>(type: "INTEGER", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Sites", x => x.Id);
                    table.ForeignKey(
                        name: "FK_Sites_Networks_NetworkId",
                        column: x => x.NetworkId,
                        principalTable: "Networks",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "Computations",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ChecklistItemId = table.Column<int>(type: "INTEGER", nullable: false),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    ParametersJson = table.Column<string>(type: "TEXT", nullable: false),
                    InputFingerprint = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    ToolVersion = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    ResultJson = table.Column<string>(type: "TEXT", nullable: false),
                    Verdict = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    Summary = table.Column<string>(type: "TEXT", maxLength: 1000, nullable: false),
                    PicturesSvg = table.Column<string>(type: "TEXT", nullable: false),
                    RunBy = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    RunByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    RunAt = table.Column<long>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Computations", x => x.Id);
                    table.ForeignKey(
                        name: "FK_Computations_ChecklistItems_ChecklistItemId",
                        column: x => x.ChecklistItemId,
                        principalTable: "ChecklistItems",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "Evidence",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ChecklistItemId = table.Column<int>(type: "INTEGER", nullable: false),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    Text = table.Column<string>(type: "TEXT", nullable: false),
                    ContentSha256 = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    FileName = table.Column<string>(type: "TEXT", maxLength: 255, nullable: true),
                    ContentType = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    SizeBytes = table.Column<long>(type: "INTEGER", nullable: true),
                    Url = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: true),
                    Role = table.Column<string>(type: "TEXT", maxLength: 32, nullable: true),
                    AddedBy = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    AddedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    AddedAt = table.Column<long>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Evidence", x => x.Id);
                    table.ForeignKey(
                        name: "FK_Evidence_ChecklistItems_ChecklistItemId",
                        column: x => x.ChecklistItemId,
                        principalTable: "ChecklistItems",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "SignOffs",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ChecklistItemId = table.Column<int>(type: "INTEGER", nullable: false),
                    UserId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    SignerName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    SignedAtUtc = table.Column<long>(type: "INTEGER", nullable: false),
                    SignedAtGpsNanoseconds = table.Column<long>(type: "INTEGER", nullable: false),
                    Meaning = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    Statement = table.Column<string>(type: "TEXT", maxLength: 4000, nullable: false),
                    EvidenceFingerprint = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    IsStale = table.Column<bool>(type: "INTEGER", nullable: false),
                    StaleSince = table.Column<long>(type: "INTEGER", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_SignOffs", x => x.Id);
                    table.ForeignKey(
                        name: "FK_SignOffs_ChecklistItems_ChecklistItemId",
                        column: x => x.ChecklistItemId,
                        principalTable: "ChecklistItems",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_AccountEvents_Sequence",
                table: "AccountEvents",
                column: "Sequence",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_ApiTokens_Hash",
                table: "ApiTokens",
                column: "Hash",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_AspNetRoleClaims_RoleId",
                table: "AspNetRoleClaims",
                column: "RoleId");

            migrationBuilder.CreateIndex(
                name: "RoleNameIndex",
                table: "AspNetRoles",
                column: "NormalizedName",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_AspNetUserClaims_UserId",
                table: "AspNetUserClaims",
                column: "UserId");

            migrationBuilder.CreateIndex(
                name: "IX_AspNetUserLogins_UserId",
                table: "AspNetUserLogins",
                column: "UserId");

            migrationBuilder.CreateIndex(
                name: "IX_AspNetUserRoles_RoleId",
                table: "AspNetUserRoles",
                column: "RoleId");

            migrationBuilder.CreateIndex(
                name: "EmailIndex",
                table: "AspNetUsers",
                column: "NormalizedEmail");

            migrationBuilder.CreateIndex(
                name: "UserNameIndex",
                table: "AspNetUsers",
                column: "NormalizedUserName",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_CaseArrivals_ReviewCaseId",
                table: "CaseArrivals",
                column: "ReviewCaseId");

            migrationBuilder.CreateIndex(
                name: "IX_Cases_CandidateId",
                table: "Cases",
                column: "CandidateId",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_Cases_GpsNanoseconds",
                table: "Cases",
                column: "GpsNanoseconds");

            migrationBuilder.CreateIndex(
                name: "IX_Cases_State",
                table: "Cases",
                column: "State");

            migrationBuilder.CreateIndex(
                name: "IX_ChecklistItems_ReviewCaseId_Key",
                table: "ChecklistItems",
                columns: new[] { "ReviewCaseId", "Key" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_Computations_ChecklistItemId",
                table: "Computations",
                column: "ChecklistItemId");

            migrationBuilder.CreateIndex(
                name: "IX_ConfigurationSnapshots_ReviewCaseId",
                table: "ConfigurationSnapshots",
                column: "ReviewCaseId");

            migrationBuilder.CreateIndex(
                name: "IX_ConfigurationSnapshots_SiteCode_CapturedAt",
                table: "ConfigurationSnapshots",
                columns: new[] { "SiteCode", "CapturedAt" });

            migrationBuilder.CreateIndex(
                name: "IX_DossierExports_ReviewCaseId",
                table: "DossierExports",
                column: "ReviewCaseId");

            migrationBuilder.CreateIndex(
                name: "IX_Evidence_ChecklistItemId",
                table: "Evidence",
                column: "ChecklistItemId");

            migrationBuilder.CreateIndex(
                name: "IX_Notifications_DedupKey",
                table: "Notifications",
                column: "DedupKey",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_Notifications_RoutedAt",
                table: "Notifications",
                column: "RoutedAt");

            migrationBuilder.CreateIndex(
                name: "IX_Notifications_UserId_CreatedAt",
                table: "Notifications",
                columns: new[] { "UserId", "CreatedAt" });

            migrationBuilder.CreateIndex(
                name: "IX_OutboxMessages_SentAt_GaveUpAt_NextAttemptAt",
                table: "OutboxMessages",
                columns: new[] { "SentAt", "GaveUpAt", "NextAttemptAt" });

            migrationBuilder.CreateIndex(
                name: "IX_OutboxMessages_UserId_CreatedAt",
                table: "OutboxMessages",
                columns: new[] { "UserId", "CreatedAt" });

            migrationBuilder.CreateIndex(
                name: "IX_SealedInjectionRecords_Commitment",
                table: "SealedInjectionRecords",
                column: "Commitment",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_SignatureRequests_CreatedAt",
                table: "SignatureRequests",
                column: "CreatedAt");

            migrationBuilder.CreateIndex(
                name: "IX_SignOffs_ChecklistItemId",
                table: "SignOffs",
                column: "ChecklistItemId");

            migrationBuilder.CreateIndex(
                name: "IX_Sites_Code",
                table: "Sites",
                column: "Code",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_Sites_NetworkId",
                table: "Sites",
                column: "NetworkId");

            migrationBuilder.CreateIndex(
                name: "IX_Timeline_ReviewCaseId_Sequence",
                table: "Timeline",
                columns: new[] { "ReviewCaseId", "Sequence" },
                unique: true);

            // The append-only guards of the record (decision 010: written out here, never built by live code): the timeline, the sign-in audit, evidence and computation records refuse updates and deletes; sign-offs may only be marked stale; a frozen configuration record refuses every change.
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_AccountEvents_no_delete BEFORE DELETE ON "AccountEvents" BEGIN SELECT RAISE(ABORT, 'AccountEvents rows are append-only: they cannot be deleted'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_AccountEvents_no_update BEFORE UPDATE ON "AccountEvents" BEGIN SELECT RAISE(ABORT, 'AccountEvents rows are append-only: they cannot be updated'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Computations_no_delete BEFORE DELETE ON "Computations" BEGIN SELECT RAISE(ABORT, 'Computations rows are append-only: they cannot be deleted'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Computations_no_update BEFORE UPDATE ON "Computations" BEGIN SELECT RAISE(ABORT, 'Computations rows are append-only: they cannot be updated'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_ConfigurationSnapshots_frozen_delete BEFORE DELETE ON "ConfigurationSnapshots" WHEN OLD."IsFrozen" = 1 BEGIN SELECT RAISE(ABORT, 'A frozen configuration record cannot be deleted'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_ConfigurationSnapshots_frozen_update BEFORE UPDATE ON "ConfigurationSnapshots" WHEN OLD."IsFrozen" = 1 BEGIN SELECT RAISE(ABORT, 'A frozen configuration record cannot be changed'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Evidence_no_delete BEFORE DELETE ON "Evidence" BEGIN SELECT RAISE(ABORT, 'Evidence rows are append-only: they cannot be deleted'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Evidence_no_update BEFORE UPDATE ON "Evidence" BEGIN SELECT RAISE(ABORT, 'Evidence rows are append-only: they cannot be updated'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_SignOffs_guard BEFORE UPDATE ON "SignOffs" WHEN OLD."IsStale" = 1 OR NEW."IsStale" = 0 OR NEW."UserId" IS NOT OLD."UserId" OR NEW."SignerName" IS NOT OLD."SignerName" OR NEW."SignedAtUtc" IS NOT OLD."SignedAtUtc" OR NEW."SignedAtGpsNanoseconds" IS NOT OLD."SignedAtGpsNanoseconds" OR NEW."Meaning" IS NOT OLD."Meaning" OR NEW."Statement" IS NOT OLD."Statement" OR NEW."EvidenceFingerprint" IS NOT OLD."EvidenceFingerprint" OR NEW."ChecklistItemId" IS NOT OLD."ChecklistItemId" BEGIN SELECT RAISE(ABORT, 'A sign-off can only be marked stale; nothing else about it can change'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_SignOffs_no_delete BEFORE DELETE ON "SignOffs" BEGIN SELECT RAISE(ABORT, 'Sign-offs cannot be deleted'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Timeline_no_delete BEFORE DELETE ON "Timeline" BEGIN SELECT RAISE(ABORT, 'Timeline rows are append-only: they cannot be deleted'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Timeline_no_update BEFORE UPDATE ON "Timeline" BEGIN SELECT RAISE(ABORT, 'Timeline rows are append-only: they cannot be updated'); END
                """);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "AccountEvents");

            migrationBuilder.DropTable(
                name: "ApiTokens");

            migrationBuilder.DropTable(
                name: "AspNetRoleClaims");

            migrationBuilder.DropTable(
                name: "AspNetUserClaims");

            migrationBuilder.DropTable(
                name: "AspNetUserLogins");

            migrationBuilder.DropTable(
                name: "AspNetUserRoles");

            migrationBuilder.DropTable(
                name: "AspNetUserTokens");

            migrationBuilder.DropTable(
                name: "CaseArrivals");

            migrationBuilder.DropTable(
                name: "Computations");

            migrationBuilder.DropTable(
                name: "ConfigurationSnapshots");

            migrationBuilder.DropTable(
                name: "DataProtectionKeys");

            migrationBuilder.DropTable(
                name: "DossierExports");

            migrationBuilder.DropTable(
                name: "Evidence");

            migrationBuilder.DropTable(
                name: "NotificationCursors");

            migrationBuilder.DropTable(
                name: "Notifications");

            migrationBuilder.DropTable(
                name: "NotificationSettings");

            migrationBuilder.DropTable(
                name: "OutboxMessages");

            migrationBuilder.DropTable(
                name: "SealedInjectionRecords");

            migrationBuilder.DropTable(
                name: "SignatureRequests");

            migrationBuilder.DropTable(
                name: "SignOffs");

            migrationBuilder.DropTable(
                name: "Sites");

            migrationBuilder.DropTable(
                name: "Timeline");

            migrationBuilder.DropTable(
                name: "AspNetRoles");

            migrationBuilder.DropTable(
                name: "AspNetUsers");

            migrationBuilder.DropTable(
                name: "ChecklistItems");

            migrationBuilder.DropTable(
                name: "Networks");

            migrationBuilder.DropTable(
                name: "Cases");
        }
    }
}
